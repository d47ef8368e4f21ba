import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { checkLedger } from '../../server/services/ledger-check'
import { binByCode, expectUnchanged, lotsIn, partByCode, partNamed, snapshot } from './stock-helpers'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client, builder: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  ;[keeper, builder] = await Promise.all([clientAs(t.app, 'storekeeper'), clientAs(t.app, 'builder')])
})
afterAll(() => t.close())

const isoDaysFromNow = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10)
const batches = async (partId: number, binCode: string) => {
  const bin = await binByCode(t.dataSource, binCode)
  return Object.fromEntries((await lotsIn(t.dataSource, partId, bin.id)).map((l) => [l.batchCode, l.quantity]))
}

describe('compounds: batches first-expiry-first-out', () => {
  it('draws the soonest-expiring good batch first and skips the expired one (demo thread-locker)', async () => {
    const tl = await partNamed(t.dataSource, 'Thread-locker, medium')
    const c1 = await binByCode(t.dataSource, 'C1-01')
    expect(await batches(tl.id, 'C1-01')).toEqual({ 'TL-2211': 1, 'TL-2307': 2 })
    for (const [batchCode, days] of [['TL-2309', 300], ['TL-2303', 30]] as const) {
      await keeper.post('/api/stock/receive', { partId: tl.id, binId: c1.id, quantity: 1, batchCode, expiresOn: isoDaysFromNow(days) }).expect(201)
    }
    const res = await builder.post('/api/stock/take', { partId: tl.id, binId: c1.id, quantity: 2 })
    expect(res.status).toBe(200)
    expect(res.body.movements.map((m: { batchCode: string; quantity: number }) => [m.batchCode, m.quantity]))
      .toEqual([['TL-2303', 1], ['TL-2307', 1]])
    expect(await batches(tl.id, 'C1-01')).toEqual({ 'TL-2211': 1, 'TL-2307': 1, 'TL-2309': 1, 'TL-2303': 0 })
  })

  it('refuses with 409 BATCH_EXPIRED when only the expired batch would cover it, and changes nothing', async () => {
    const tl = await partNamed(t.dataSource, 'Thread-locker, medium')
    const c1 = await binByCode(t.dataSource, 'C1-01')
    const [expired] = (await lotsIn(t.dataSource, tl.id, c1.id)).filter((l) => l.batchCode === 'TL-2211')
    const before = await snapshot(t.dataSource)
    const three = await builder.post('/api/stock/take', { partId: tl.id, binId: c1.id, quantity: 3 })
    expect(three.status).toBe(409)
    expect(three.body.error.code).toBe('BATCH_EXPIRED')
    expect(three.body.error.message).toMatch(/TL-2211 \(expired \d{4}-\d{2}-\d{2}\)/)
    const chosen = await builder.post('/api/stock/take', { partId: tl.id, lotId: expired.id, quantity: 1 })
    expect(chosen.body.error.code).toBe('BATCH_EXPIRED')
    const byBuilder = await builder.post('/api/stock/take', { partId: tl.id, lotId: expired.id, quantity: 1, allowExpired: true, reason: 'only for a test piece' })
    expect(byBuilder.status).toBe(403)
    const noReason = await keeper.post('/api/stock/take', { partId: tl.id, lotId: expired.id, quantity: 1, allowExpired: true })
    expect(noReason.body.error.code).toBe('REASON_REQUIRED')
    await expectUnchanged(t.dataSource, before)
  })

  it('lets a storekeeper override with a reason, drawing the expired batch first and recording why', async () => {
    const tl = await partNamed(t.dataSource, 'Thread-locker, medium')
    const c1 = await binByCode(t.dataSource, 'C1-01')
    const res = await keeper.post('/api/stock/take', { partId: tl.id, binId: c1.id, quantity: 2, allowExpired: true, reason: 'Workshop demo bolts, strength not needed' })
    expect(res.status).toBe(200)
    expect(res.body.movements.map((m: { batchCode: string }) => m.batchCode)).toEqual(['TL-2211', 'TL-2307'])
    expect(res.body.movements[0].reason).toBe('Workshop demo bolts, strength not needed')
    expect(await batches(tl.id, 'C1-01')).toEqual({ 'TL-2211': 0, 'TL-2307': 0, 'TL-2309': 1, 'TL-2303': 0 })
  })

  it('puts a container back into its own batch and moves a batch to another bin keeping code and expiry', async () => {
    const oil = await partNamed(t.dataSource, 'Steam cylinder oil')
    const [c3, c5] = await Promise.all([binByCode(t.dataSource, 'C1-03'), binByCode(t.dataSource, 'C1-05')])
    const [lot] = await lotsIn(t.dataSource, oil.id, c3.id)
    const take = await builder.post('/api/stock/take', { partId: oil.id, binId: c3.id, quantity: 1 })
    expect(take.body.movements[0].batchCode).toBe('SC-24')
    const back = await builder.post('/api/stock/return', { partId: oil.id, binId: c3.id, quantity: 1, lotId: lot.id })
    expect(back.body.movements[0]).toMatchObject({ batchCode: 'SC-24', toBinCode: 'C1-03' })
    const noBatch = await builder.post('/api/stock/return', { partId: oil.id, binId: c3.id, quantity: 1 })
    expect(noBatch.body.error.code).toBe('BATCH_REQUIRED')
    const move = await keeper.post('/api/stock/move', { lotId: lot.id, toBinId: c5.id, quantity: 1 })
    expect(move.body.movements[0]).toMatchObject({ kind: 'move', fromBinCode: 'C1-03', toBinCode: 'C1-05', batchCode: 'SC-24' })
    const [moved] = await lotsIn(t.dataSource, oil.id, c5.id)
    expect(moved).toMatchObject({ batchCode: 'SC-24', expiresOn: lot.expiresOn, quantity: 1 })
  })
})

describe('bar stock: pieces and offcuts', () => {
  it('cuts from the shortest piece that fits and leaves the rest as the offcut in the same lot', async () => {
    const hex = await partByCode(t.dataSource, 'HEX-6.35')
    const b1 = await binByCode(t.dataSource, 'B1-01')
    const [long, short] = await lotsIn(t.dataSource, hex.id, b1.id)
    expect([long.quantity, short.quantity]).toEqual([1000, 310])
    const res = await builder.post('/api/stock/take', { partId: hex.id, binId: b1.id, quantity: 300 })
    expect(res.status).toBe(200)
    expect(res.body.movements).toHaveLength(1)
    expect(res.body.movements[0]).toMatchObject({ kind: 'draw', quantity: 300, fromLotId: short.id })
    expect((await lotsIn(t.dataSource, hex.id, b1.id)).map((l) => l.quantity)).toEqual([1000, 10])
  })

  it('records the saw kerf as its own movement beside the cut', async () => {
    const hex = await partByCode(t.dataSource, 'HEX-6.35')
    const b1 = await binByCode(t.dataSource, 'B1-01')
    const res = await builder.post('/api/stock/take', { partId: hex.id, binId: b1.id, quantity: 250, kerfMm: 1.3 })
    expect(res.body.movements.map((m: { kind: string; quantity: number }) => [m.kind, m.quantity])).toEqual([['draw', 250], ['adjust', 1.3]])
    expect(res.body.movements[1].reason).toBe('Saw kerf of the 250 mm cut')
    const [long] = await lotsIn(t.dataSource, hex.id, b1.id)
    expect(long.quantity).toBeCloseTo(748.7, 6)
  })

  it('takes from a chosen piece, and refuses a length no piece has with 409, changing nothing', async () => {
    const round = await partByCode(t.dataSource, 'ROUND-12')
    const b3 = await binByCode(t.dataSource, 'B1-03')
    const [, second] = await lotsIn(t.dataSource, round.id, b3.id)
    const res = await builder.post('/api/stock/take', { partId: round.id, lotId: second.id, quantity: 120 })
    expect(res.body.movements[0].fromLotId).toBe(second.id)
    expect((await lotsIn(t.dataSource, round.id, b3.id)).map((l) => l.quantity)).toEqual([1000, 880])
    const before = await snapshot(t.dataSource)
    const tooLong = await builder.post('/api/stock/take', { partId: round.id, binId: b3.id, quantity: 1200 })
    expect(tooLong.status).toBe(409)
    expect(tooLong.body.error.code).toBe('NO_PIECE_LONG_ENOUGH')
    expect(tooLong.body.error.message).toContain('the longest in that bin is 1000 mm')
    const fromChosen = await builder.post('/api/stock/take', { partId: round.id, lotId: second.id, quantity: 900 })
    expect(fromChosen.body.error.code).toBe('NO_PIECE_LONG_ENOUGH')
    await expectUnchanged(t.dataSource, before)
  })

  it('puts an offcut back as a new piece and moves a piece only whole', async () => {
    const round = await partByCode(t.dataSource, 'ROUND-12')
    const [b3, b8] = await Promise.all([binByCode(t.dataSource, 'B1-03'), binByCode(t.dataSource, 'B1-08')])
    await builder.post('/api/stock/return', { partId: round.id, binId: b3.id, quantity: 45, reason: 'offcut' }).expect(200)
    expect((await lotsIn(t.dataSource, round.id, b3.id)).map((l) => l.quantity)).toEqual([1000, 880, 45])
    const [first] = await lotsIn(t.dataSource, round.id, b3.id)
    const before = await snapshot(t.dataSource)
    expect((await keeper.post('/api/stock/move', { lotId: first.id, toBinId: b8.id, quantity: 500 })).body.error.code).toBe('WHOLE_PIECE')
    expect((await keeper.post('/api/stock/move', { partId: round.id, fromBinId: b3.id, toBinId: b8.id })).body.error.code).toBe('LOT_REQUIRED')
    await expectUnchanged(t.dataSource, before)
    const moved = await keeper.post('/api/stock/move', { lotId: first.id, toBinId: b8.id })
    expect(moved.body.movements[0]).toMatchObject({ quantity: 1000, fromBinCode: 'B1-03', toBinCode: 'B1-08' })
    expect((await lotsIn(t.dataSource, round.id, b8.id)).map((l) => l.quantity)).toEqual([1000])
  })

  it('counts a bar piece to its measured length', async () => {
    const round = await partByCode(t.dataSource, 'ROUND-12')
    const b3 = await binByCode(t.dataSource, 'B1-03')
    const piece = (await lotsIn(t.dataSource, round.id, b3.id)).find((l) => l.quantity === 880)!
    const res = await keeper.post('/api/stock/count', { binId: b3.id, lines: [{ lotId: piece.id, counted: 874.5 }], reason: 'Measured' })
    expect(res.body.movements[0]).toMatchObject({ kind: 'count', quantity: 5.5, fromLotId: piece.id })
  })
})

describe('the ledger after batches and bar pieces', () => {
  it('reconciles', async () => {
    const report = await checkLedger(t.dataSource)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
  })
})
