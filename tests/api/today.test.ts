import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Movement } from '../../server/entities'

let t: Awaited<ReturnType<typeof createTestApp>>
let viewer: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  viewer = await clientAs(t.app, 'viewer')
})
afterAll(() => t.close())

describe('GET /api/today on the demo workshop', () => {
  it('lists the low parts, the expired and expiring batches and the late order, for any signed-in role', async () => {
    const res = await viewer.get('/api/today')
    expect(res.status).toBe(200)
    const gasket = res.body.lowStock.items.find((l: { partName: string }) => l.partName.startsWith('Valve chest gasket'))
    // Demo: 3 valve chest gaskets in A3-02, reorder point 4.
    expect(gasket).toMatchObject({ available: 3, reorderPoint: 4, onOrder: 0, unit: 'pcs' })
    expect(res.body.lowStock.count).toBe(res.body.lowStock.items.length)
    const batches = Object.fromEntries(res.body.expiry.items.map((e: { batchCode: string }) => [e.batchCode, e]))
    // Demo: thread-locker batch TL-2211 expired 17 days ago; retaining compound RC-2402 expires in 18 days.
    expect(batches['TL-2211']).toMatchObject({ expired: true, binCode: 'C1-01', quantity: 1 })
    expect(batches['RC-2402']).toMatchObject({ expired: false, binCode: 'C1-02' })
    expect(batches['TL-2307']).toBeUndefined()
    expect(res.body.expiry).toMatchObject({ expired: 1, expiring: 1 })
    // Demo: PO-0001 to the metal stockholder, sent 12 days ago with a 10-day lead time: 2 days late.
    expect(res.body.orders).toMatchObject({ open: 1, late: 1 })
    expect(res.body.orders.items[0]).toMatchObject({ number: 'PO-0001', status: 'sent', late: true, supplierName: 'Brassworks Metal Stockholders (invented)' })
    expect(res.body.expiryWarningDays).toBe(30)
  })

  it('charts stock value by kind and this week\'s movements', async () => {
    const { charts } = (await viewer.get('/api/today')).body
    const kinds = charts.stockValueByKind.map((k: { kind: string }) => k.kind)
    expect(kinds).toEqual(expect.arrayContaining(['fastener', 'gasket', 'stock', 'compound']))
    // Fasteners: 64 7BA studs × 0.12 = 7.68 alone, so the fastener value is above that.
    expect(charts.stockValueByKind.find((k: { kind: string }) => k.kind === 'fastener').value).toBeGreaterThan(7.68)
    expect(charts.movementsPerWeek).toHaveLength(12)
    const receipts = await t.dataSource.getRepository(Movement).countBy({ kind: 'receive' })
    const charted = charts.movementsPerWeek.reduce((a: number, w: { receive: number }) => a + w.receive, 0)
    expect(charted).toBe(receipts)
  })

  it('pages the whole list behind a count and refuses an unknown list with 400', async () => {
    const page = (await viewer.get('/api/today/expiry?pageSize=1')).body
    expect(page).toMatchObject({ total: 2, page: 1, pageSize: 1 })
    expect(page.items).toHaveLength(1)
    expect((await viewer.get('/api/today/everything')).status).toBe(400)
  })
})
