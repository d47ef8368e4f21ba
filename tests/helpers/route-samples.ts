import type { DataSource } from 'typeorm'

/** Real demo ids for every path parameter, so each route reaches its real handler. */
export interface RouteSamples {
  fill: (path: string) => string
}

const MISSING = 999_999

/** Reads the first row ids of the demo tables; a table the demo leaves empty gets an id nobody has. */
export async function routeSamples(ds: DataSource): Promise<RouteSamples> {
  const first = async (sql: string): Promise<string> => {
    const rows = await ds.query(sql) as Record<string, unknown>[]
    return rows.length ? String(Object.values(rows[0])[0]) : String(MISSING)
  }
  const builder = await first("SELECT id FROM users WHERE role = 'builder' ORDER BY id")
  const buildId = await first(`SELECT id FROM builds WHERE "ownerId" = ${builder} ORDER BY id`)
  const supplierId = await first('SELECT id FROM suppliers ORDER BY id')
  const ids: Record<string, Record<string, string>> = {
    parts: { id: await first('SELECT id FROM parts ORDER BY id'), labelCode: await first('SELECT "labelCode" FROM parts ORDER BY id') },
    bins: { id: await first('SELECT id FROM bins ORDER BY id'), code: await first('SELECT code FROM bins ORDER BY id') },
    scan: { id: await first('SELECT id FROM bins ORDER BY id') },
    racks: { id: await first('SELECT id FROM racks ORDER BY id') },
    workshops: { id: await first('SELECT id FROM workshops ORDER BY id') },
    builds: { id: buildId, lineId: await first(`SELECT id FROM build_lines WHERE "buildId" = ${buildId} ORDER BY id`) },
    suppliers: { id: supplierId, offerId: await first(`SELECT id FROM supplier_parts WHERE "supplierId" = ${supplierId} ORDER BY id`) },
    orders: { id: await first('SELECT id FROM purchase_orders ORDER BY id') },
    outbox: { id: await first('SELECT id FROM outbox_messages ORDER BY id'), index: '0' },
    attachments: { id: await first('SELECT id FROM attachments ORDER BY id'), width: '160' },
    movements: { id: await first('SELECT id FROM movements ORDER BY id') },
    users: { id: await first("SELECT id FROM users WHERE role = 'viewer' ORDER BY id") },
    admin: { key: 'workshopName' },
    today: { list: 'low-stock' },
  }
  return {
    fill: (path) => {
      const resource = path.split('/')[2]
      return path.replace(/:(\w+)/g, (_m, name: string) => {
        const value = ids[resource]?.[name]
        if (value === undefined) throw new Error(`no sample for :${name} in ${path}`)
        return encodeURIComponent(value)
      })
    },
  }
}
