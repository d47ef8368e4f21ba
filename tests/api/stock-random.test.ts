import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestApp } from '../helpers/app'
import { inTransaction, stockEvents } from '../../server/db'
import { AppError } from '../../server/errors'
import { Bin, Movement, Part, StockLot, User } from '../../server/entities'
import { checkLedger } from '../../server/services/ledger-check'
import {
  adjustStock, countBin, drawFromLots, moveStock, receiveInto, returnToBin, reverseMovement,
} from '../../server/services/stock'
import { stockModeOf } from '../../shared/types/domain'
import { prng } from '../helpers/prng'

const SEED = 20_240_611
const STEPS = 1000

let t: Awaited<ReturnType<typeof createTestApp>>
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  // Alerts follow every stock change; this series tests the ledger alone, so it runs without them.
  stockEvents.removeAllListeners('stock-changed')
})
afterAll(() => t.close())

describe('a seeded random series of 1,000 stock changes through the services', () => {
  it('keeps every lot equal to its ledger, never negative, and part totals equal to an independent tally', async () => {
    const rand = prng(SEED)
    const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)]
    const parts = await t.dataSource.getRepository(Part).find()
    const bins = (await t.dataSource.getRepository(Bin).find()).filter((b) => !b.retired)
    const userId = (await t.dataSource.getRepository(User).findOneByOrFail({ username: 'keeper' })).id
    const totals = async () => {
      const rows: { partId: number; n: number }[] = await t.dataSource.query('SELECT "partId" AS "partId", SUM(quantity) AS n FROM stock_lots GROUP BY "partId"')
      return new Map(rows.map((r) => [r.partId, r.n]))
    }
    const tally = await totals()
    const effect = (m: Movement) => (m.toLotId ? m.quantity : 0) - (m.fromLotId ? m.quantity : 0)
    const done: number[] = []
    const outcome = { ok: 0, refused: 0 }

    for (let step = 0; step < STEPS; step++) {
      const part = pick(parts)
      const mode = stockModeOf(part.kind)
      const bin = pick(bins)
      const size = mode === 'length' ? Math.round(rand() * 4000) / 10 + 1 : 1 + Math.floor(rand() * 8)
      const lots = await t.dataSource.getRepository(StockLot).findBy({ partId: part.id })
      const lot = lots.length ? pick(lots) : undefined
      const batch = { batchCode: `R-${1 + Math.floor(rand() * 3)}`, expiresOn: '2031-06-30' }
      const op = pick(['receive', 'receive', 'draw', 'draw', 'return', 'move', 'adjust', 'count', 'reverse'])
      try {
        const moves: Movement[] = await inTransaction(async (tx) => {
          switch (op) {
            case 'receive': return receiveInto(tx, { partId: part.id, binId: bin.id, quantity: size, ...(mode === 'batch' ? batch : {}) }, userId)
            case 'draw': return drawFromLots(tx, { partId: part.id, quantity: size, binId: rand() < 0.5 ? bin.id : undefined, userId, allowReserved: true, reason: 'random series' })
            case 'return': return [await returnToBin(tx, { partId: part.id, binId: bin.id, quantity: size, ...(mode === 'batch' ? batch : {}), userId })]
            case 'move': return lot ? [await moveStock(tx, { lotId: lot.id, toBinId: bin.id, quantity: mode === 'length' ? undefined : size, userId })] : []
            case 'adjust': return lot ? [await adjustStock(tx, { lotId: lot.id, delta: rand() < 0.5 ? -size : size, userId, reason: 'random series' })] : []
            case 'count': return lot ? countBin(tx, { binId: lot.binId, lines: [{ lotId: lot.id, counted: mode === 'length' ? size : Math.floor(rand() * 10) }], userId }) : []
            default: return done.length ? [await reverseMovement(tx, pick(done), userId)] : []
          }
        })
        for (const m of moves) {
          tally.set(m.partId, (tally.get(m.partId) ?? 0) + effect(m))
          done.push(m.id)
        }
        outcome.ok++
      } catch (e) {
        if (!(e instanceof AppError) || e.status >= 500) throw e
        outcome.refused++
      }
    }

    const report = await checkLedger(t.dataSource)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
    const actual = await totals()
    for (const [partId, n] of tally) expect(actual.get(partId) ?? 0).toBeCloseTo(n, 6)
    // Both paths were exercised: plenty of changes went through and plenty were refused.
    expect(outcome.ok).toBeGreaterThan(400)
    expect(outcome.refused).toBeGreaterThan(50)
    console.info(`random series: ${outcome.ok} applied, ${outcome.refused} refused, ${report.movements} movements, ${report.lots} lots`)
  })
})
