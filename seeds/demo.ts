import type { DataSource } from 'typeorm'
import { useDataSource, inTransaction } from '../server/db'
import { Bin, Build, BuildLine, Part, Rack, Supplier, SupplierPart, User, Workshop } from '../server/entities'
import { hashPassword } from '../server/services/users'
import { createPart } from '../server/services/parts'
import { receiveInto } from '../server/services/stock'
import { newLabelCode } from '../server/services/codes'
import { reserveIn } from '../server/services/builds-reserve'
import { DEMO_USERS } from './demo-users'
import { DEMO_CATALOGUE } from './demo-catalogue'
import { seedDemoOrders } from './demo-orders'

const RACKS = [
  { code: 'A1', name: 'Drawer cabinet A1 — BA fasteners', bins: 12 },
  { code: 'A2', name: 'Drawer cabinet A2 — ME and metric fasteners', bins: 10 },
  { code: 'A3', name: 'Drawer cabinet A3 — gaskets and packing', bins: 6 },
  { code: 'B1', name: 'Bar rack B1 — under the bench', bins: 8 },
  { code: 'C1', name: 'Steel cupboard C1 — compounds and oils', bins: 6 },
]

const isoDaysFromNow = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10)

/** True when the database has no parts yet (the demo loads only then). */
export async function isEmpty(ds: DataSource) {
  return (await ds.getRepository(Part).count()) === 0 && (await ds.getRepository(Bin).count()) === 0
}

/** Loads the invented demo scenario through the same services the app uses. */
export async function seedDemo(ds: DataSource) {
  useDataSource(ds)
  await inTransaction(async (tx) => {
    const users: Record<string, User> = {}
    for (const u of DEMO_USERS) {
      const existing = await tx.findOneBy(User, { username: u.username })
      users[u.username] = existing ?? await tx.save(User, {
        username: u.username, displayName: u.displayName, role: u.role, email: u.email,
        active: true, passwordHash: await hashPassword(u.password),
      })
    }
    const workshop = await tx.save(Workshop, { name: 'Hollin Dale SME clubroom workshop' })
    const bins: Record<string, Bin> = {}
    for (const r of RACKS) {
      const rack = await tx.save(Rack, { code: r.code, name: r.name, workshopId: workshop.id })
      for (let i = 1; i <= r.bins; i++) {
        const code = `${r.code}-${String(i).padStart(2, '0')}`
        bins[code] = await tx.save(Bin, { code, labelCode: newLabelCode('B'), description: '', rackId: rack.id, retired: false, defaultPartId: null })
      }
    }
    const supplier = await tx.save(Supplier, {
      name: 'Wyvern Model Supplies (invented)', email: 'orders@wyvern-models.example',
      website: 'https://wyvern-models.example', leadTimeDays: 5, notes: 'Post on Mondays and Thursdays.',
    })
    const keeper = users.keeper
    const parts: Part[] = []
    for (const line of DEMO_CATALOGUE) {
      const part = await createPart(tx, { ...line.part, preferredSupplierId: supplier.id })
      parts.push(part)
      for (const s of line.stock) bins[s.bin].description ||= part.name
      await tx.save(SupplierPart, { supplierId: supplier.id, partId: part.id, supplierCode: `WM-${part.code}`, packSize: part.kind === 'fastener' ? 10 : 1, packPrice: part.unitCost * (part.kind === 'fastener' ? 10 : 1) })
      for (const s of line.stock) {
        await receiveInto(tx, {
          partId: part.id, binId: bins[s.bin].id, quantity: s.quantity, pieces: s.pieces,
          batchCode: s.batchCode, expiresOn: s.expiresInDays === undefined ? undefined : isoDaysFromNow(s.expiresInDays),
          reason: 'Opening stock count',
        }, keeper.id)
      }
    }
    await tx.save(Bin, Object.values(bins))
    await seedBuilds(tx, users, parts)
  })
  await seedDemoOrders()
}

type Tx = Parameters<Parameters<typeof inTransaction>[0]>[0]

async function seedBuilds(tx: Tx, users: Record<string, User>, parts: Part[]) {
  const byCode = (prefix: string) => parts.find((p) => p.code.startsWith(prefix))!
  const vertical = await tx.save(Build, {
    name: 'Single-cylinder vertical engine, 7/8 in bore', ownerId: users.builder.id, status: 'active',
    description: 'Double-acting vertical with a piston valve, for the club\'s display stand at the summer rally.',
    targetDate: isoDaysFromNow(120),
  })
  const lines: [string, number, string][] = [
    ['7BA-STUD-12', 24, 'cylinder cover studs'],
    ['7BA-NUT', 24, 'cylinder cover nuts'],
    ['6BA-STUD-20', 12, 'valve chest studs'],
    ['GSK-0.4', 4, 'cylinder cover gaskets'],
  ]
  let position = 0
  for (const [code, quantity, note] of lines) {
    await tx.save(BuildLine, { buildId: vertical.id, partId: byCode(code).id, quantity, note, position: position++ })
  }
  const oscillator = await tx.save(Build, {
    name: 'Single oscillating engine for the junior section', ownerId: users.keeper.id, status: 'planned',
    description: 'A simple first engine for the juniors to build over the winter.', targetDate: isoDaysFromNow(60),
  })
  await tx.save(BuildLine, { buildId: oscillator.id, partId: byCode('ROUND-9.525').id, quantity: 60, pieces: 2, note: 'cylinder blanks', position: 0 })
  // The vertical engine holds its gaskets, and wants more ME studs for the steam chest than the
  // stores have: reserving what there is (through the builds service) records one shortage.
  const meStud = parts.find((p) => p.name.startsWith('5/32-40 ME stud'))!
  const chest = await tx.save(BuildLine, { buildId: vertical.id, partId: meStud.id, quantity: 16, note: 'steam chest cover studs', position })
  const gaskets = await tx.findOneByOrFail(BuildLine, { buildId: vertical.id, partId: byCode('GSK-0.4').id })
  for (const line of [gaskets, chest]) await reserveIn(tx, vertical, { lineId: line.id, allowPartial: true }, users.builder.id)
}
