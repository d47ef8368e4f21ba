/**
 * A randomized soak of the stock ledger: N mixed operations (receive, take, reserve, release,
 * move, count, order receipt) from several simulated members working at once through the
 * services, then checkLedger and a search for negative stock.
 *   npx tsx --tsconfig tsconfig.server.json scripts/ledger-soak.ts [operations=10000] [members=6]
 * tests/api/ledger-soak.test.ts runs a smaller count inside the test suite.
 */
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { pathToFileURL } from 'node:url'
import type { DataSource } from 'typeorm'
import { inTransaction, stockEvents } from '../server/db'
import { AppError } from '../server/errors'
import { Bin, BuildLine, Build, Part, PurchaseLine, PurchaseOrder, StockLot, User } from '../server/entities'
import { checkLedger } from '../server/services/ledger-check'
import { countBin, drawFromLots, moveStock, receiveInto } from '../server/services/stock'
import { release, reserve } from '../server/services/builds-reserve'
import { createOrder } from '../server/services/orders'
import { receiveOrder } from '../server/services/order-receive'
import { stockModeOf } from '../shared/types/domain'
import { prng } from '../tests/helpers/prng'

export interface SoakResult {
  operations: number
  applied: number
  refused: number
  byKind: Record<string, number>
  ms: number
  differences: number
  negativeLots: number
}

const KINDS = ['receive', 'take', 'take', 'reserve', 'release', 'move', 'count', 'order-receipt'] as const

/** Runs `operations` random operations split over `members` concurrent workers on a demo database. */
export async function runSoak(ds: DataSource, operations: number, members = 6, seed = 20_240_615): Promise<SoakResult> {
  const started = Date.now()
  const parts = (await ds.getRepository(Part).find()).filter((p) => !p.archived && stockModeOf(p.kind) === 'count')
  const bins = (await ds.getRepository(Bin).find()).filter((b) => !b.retired)
  const keeper = await ds.getRepository(User).findOneByOrFail({ role: 'storekeeper' })
  const builder = await ds.getRepository(User).findOneByOrFail({ role: 'builder' })
  const builds = await ds.getRepository(Build).find()
  const lines = await ds.getRepository(BuildLine).find()
  const supplierPart = (await ds.query('SELECT "supplierId" AS "supplierId", "partId" AS "partId" FROM supplier_parts ORDER BY id LIMIT 6')) as { supplierId: number; partId: number }[]
  const order = await createOrder({ supplierId: supplierPart[0].supplierId, lines: supplierPart.filter((s) => s.supplierId === supplierPart[0].supplierId).map((s) => ({ partId: s.partId, packs: 5 })) }, keeper.id)
  await ds.getRepository(PurchaseOrder).update(order.id, { status: 'sent' })
  const orderLines = await ds.getRepository(PurchaseLine).findBy({ orderId: order.id })
  const result: SoakResult = { operations, applied: 0, refused: 0, byKind: {}, ms: 0, differences: 0, negativeLots: 0 }

  const one = async (rand: () => number) => {
    const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)]
    const kind = pick([...KINDS])
    const part = pick(parts)
    const bin = pick(bins)
    const n = 1 + Math.floor(rand() * 6)
    const line = pick(lines)
    const build = builds.find((b) => b.id === line.buildId)!
    const actor = build.ownerId === builder.id && rand() < 0.5 ? builder : keeper
    result.byKind[kind] = (result.byKind[kind] ?? 0) + 1
    switch (kind) {
      case 'receive': return inTransaction((tx) => receiveInto(tx, { partId: part.id, binId: bin.id, quantity: n }, keeper.id))
      case 'take': return inTransaction((tx) => drawFromLots(tx, { partId: part.id, quantity: n, binId: rand() < 0.5 ? bin.id : undefined, userId: actor.id, reason: 'soak' }))
      case 'reserve': return reserve(line.buildId, { lineId: line.id, quantity: n, allowPartial: rand() < 0.5 }, actor)
      case 'release': return release(line.buildId, { lineId: line.id }, actor)
      case 'move': {
        const lot = pick(await ds.getRepository(StockLot).findBy({ partId: part.id }))
        return lot ? inTransaction((tx) => moveStock(tx, { lotId: lot.id, toBinId: bin.id, quantity: n, userId: keeper.id })) : undefined
      }
      case 'count': return inTransaction((tx) => countBin(tx, { binId: bin.id, lines: [{ partId: part.id, counted: Math.floor(rand() * 20) }], userId: keeper.id }))
      default: {
        const ol = pick(orderLines)
        return receiveOrder(order.id, { lines: [{ lineId: ol.id, binId: bin.id, quantity: n }], confirmOverReceipt: true }, keeper.id)
      }
    }
  }

  let next = 0
  const worker = async (w: number) => {
    const rand = prng(seed + w)
    while (next < operations) {
      next++
      try {
        await one(rand)
        result.applied++
      } catch (e) {
        if (!(e instanceof AppError) || e.status >= 500) throw e
        result.refused++
      }
    }
  }
  await Promise.all(Array.from({ length: members }, (_, w) => worker(w)))

  const report = await checkLedger(ds)
  result.differences = report.differences.length
  result.negativeLots = report.negativeLots
  result.ms = Date.now() - started
  return result
}

async function main() {
  const operations = Number(process.argv[2] ?? 10_000)
  const members = Number(process.argv[3] ?? 6)
  const { openDatabase } = await import('../server/database')
  const { seedDemo } = await import('../seeds/demo')
  const dir = mkdtempSync(join(tmpdir(), 'binwright-soak-'))
  const ds = await openDatabase(join(dir, 'soak.sqlite'))
  await seedDemo(ds)
  stockEvents.removeAllListeners('stock-changed')
  const r = await runSoak(ds, operations, members)
  console.log(JSON.stringify(r, null, 2))
  await ds.destroy()
  rmSync(dir, { recursive: true, force: true })
  if (r.differences || r.negativeLots) process.exit(1)
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) void main()
