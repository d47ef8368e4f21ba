import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { checkLedger } from '../../server/services/ledger-check'
import { Build, Movement, Reservation, StockLot } from '../../server/entities'
import { binByCode, expectUnchanged, lastMovement, lotsIn, partByCode, snapshot } from './stock-helpers'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client, builder: Client, viewer: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  ;[keeper, builder, viewer] = await Promise.all([clientAs(t.app, 'storekeeper'), clientAs(t.app, 'builder'), clientAs(t.app, 'viewer')])
})
afterAll(() => t.close())

const qty = async (partId: number, binCode: string) => {
  const bin = await binByCode(t.dataSource, binCode)
  return (await lotsIn(t.dataSource, partId, bin.id)).reduce((s, l) => s + l.quantity, 0)
}

describe('the ledger after the demo scenario', () => {
  it('reconciles: every lot equals the sum of its movements and none is negative', async () => {
    const report = await checkLedger(t.dataSource)
    expect(report.movements).toBeGreaterThan(30)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
  })
})

describe('POST /api/stock/* for counted parts', () => {
  it('receives into a bin: the lot grows and one receive row names the bin and the user', async () => {
    const stud = await partByCode(t.dataSource, '7BA-STUD-12')
    const bin = await binByCode(t.dataSource, 'A1-01')
    const res = await keeper.post('/api/stock/receive', { partId: stud.id, binId: bin.id, quantity: 10, reason: 'Club order' })
    expect(res.status).toBe(201)
    expect(res.body.movements).toHaveLength(1)
    expect(res.body.movements[0]).toMatchObject({
      kind: 'receive', partCode: stud.code, quantity: 10, fromBinCode: null, toBinCode: 'A1-01', userName: expect.any(String), reason: 'Club order',
    })
    expect(await qty(stud.id, 'A1-01')).toBe(74)
  })

  it('lets a builder take and put back, each a ledger row', async () => {
    const stud = await partByCode(t.dataSource, '7BA-STUD-12')
    const bin = await binByCode(t.dataSource, 'A1-01')
    const take = await builder.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 4 })
    expect(take.status).toBe(200)
    expect(take.body.movements[0]).toMatchObject({ kind: 'draw', quantity: 4, fromBinCode: 'A1-01', toBinCode: null })
    expect(await qty(stud.id, 'A1-01')).toBe(70)
    const back = await builder.post('/api/stock/return', { partId: stud.id, binId: bin.id, quantity: 2, reason: 'Not needed' })
    expect(back.status).toBe(200)
    expect(back.body.movements[0]).toMatchObject({ kind: 'return', quantity: 2, toBinCode: 'A1-01', reason: 'Not needed' })
    expect(await qty(stud.id, 'A1-01')).toBe(72)
  })

  it('moves between bins as one row out of one lot and into the other', async () => {
    const stud = await partByCode(t.dataSource, '7BA-STUD-12')
    const [from, to] = await Promise.all([binByCode(t.dataSource, 'A1-01'), binByCode(t.dataSource, 'A1-11')])
    const res = await keeper.post('/api/stock/move', { partId: stud.id, fromBinId: from.id, toBinId: to.id, quantity: 12 })
    expect(res.status).toBe(200)
    expect(res.body.movements[0]).toMatchObject({ kind: 'move', quantity: 12, fromBinCode: 'A1-01', toBinCode: 'A1-11' })
    expect(await qty(stud.id, 'A1-01')).toBe(60)
    expect(await qty(stud.id, 'A1-11')).toBe(12)
  })

  it('adjusts with a reason (storekeeper) and refuses an adjustment without one', async () => {
    const stud = await partByCode(t.dataSource, '7BA-STUD-12')
    const bin = await binByCode(t.dataSource, 'A1-01')
    const before = await snapshot(t.dataSource)
    const bare = await keeper.post('/api/stock/adjust', { partId: stud.id, binId: bin.id, delta: -3, reason: '' })
    expect(bare.status).toBe(400)
    expect(bare.body.error.code).toBe('INVALID_INPUT')
    await expectUnchanged(t.dataSource, before)
    const res = await keeper.post('/api/stock/adjust', { partId: stud.id, binId: bin.id, delta: -3, reason: 'Three bent in the drawer' })
    expect(res.status).toBe(200)
    expect(res.body.movements[0]).toMatchObject({ kind: 'adjust', quantity: 3, fromBinCode: 'A1-01', reason: 'Three bent in the drawer' })
    expect(await qty(stud.id, 'A1-01')).toBe(57)
    expect((await builder.post('/api/stock/adjust', { partId: stud.id, binId: bin.id, delta: 1, reason: 'found one' })).status).toBe(403)
  })

  it('counts a bin: differences become count rows with the reason, equal counts write nothing', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const bin = await binByCode(t.dataSource, 'A1-03')
    const [lot] = await lotsIn(t.dataSource, nut.id, bin.id)
    const before = (await snapshot(t.dataSource)).movements
    const same = await keeper.post('/api/stock/count', { binId: bin.id, lines: [{ lotId: lot.id, counted: 120 }] })
    expect(same.status).toBe(200)
    expect(same.body.movements).toEqual([])
    expect((await snapshot(t.dataSource)).movements).toBe(before)
    const res = await keeper.post('/api/stock/count', { binId: bin.id, lines: [{ lotId: lot.id, counted: 117 }], reason: 'Spring stock-take' })
    expect(res.body.movements).toHaveLength(1)
    expect(res.body.movements[0]).toMatchObject({ kind: 'count', quantity: 3, fromBinCode: 'A1-03', reason: 'Spring stock-take' })
    const up = await keeper.post('/api/stock/count', { binId: bin.id, lines: [{ partId: nut.id, counted: 121 }] })
    expect(up.body.movements[0]).toMatchObject({ kind: 'count', quantity: 4, toBinCode: 'A1-03', reason: 'Stock-take' })
    expect(await qty(nut.id, 'A1-03')).toBe(121)
  })

  it('records a part found in a bin during a count as a count into a new lot', async () => {
    const washer = await partByCode(t.dataSource, '7BA-WASHER')
    const bin = await binByCode(t.dataSource, 'A2-08')
    const res = await keeper.post('/api/stock/count', { binId: bin.id, lines: [{ partId: washer.id, counted: 15 }] })
    expect(res.status).toBe(200)
    expect(res.body.movements[0]).toMatchObject({ kind: 'count', quantity: 15, toBinCode: 'A2-08' })
    expect(await qty(washer.id, 'A2-08')).toBe(15)
  })

  it('refuses a take beyond the stock with 409 INSUFFICIENT_STOCK and changes nothing', async () => {
    const stud = await partByCode(t.dataSource, '7BA-STUD-12')
    const bin = await binByCode(t.dataSource, 'A1-01')
    const before = await snapshot(t.dataSource)
    const res = await builder.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 58 })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('INSUFFICIENT_STOCK')
    expect(res.body.error.message).toMatch(/Only 57 .*58 was asked for\. Nothing was changed\./)
    await expectUnchanged(t.dataSource, before)
  })

  it('refuses half items, a viewer, and a move or count that would go below zero', async () => {
    const stud = await partByCode(t.dataSource, '7BA-STUD-12')
    const [from, to] = await Promise.all([binByCode(t.dataSource, 'A1-01'), binByCode(t.dataSource, 'A1-11')])
    const before = await snapshot(t.dataSource)
    expect((await builder.post('/api/stock/take', { partId: stud.id, binId: from.id, quantity: 1.5 })).body.error.code).toBe('WHOLE_ITEMS')
    expect((await viewer.post('/api/stock/take', { partId: stud.id, binId: from.id, quantity: 1 })).status).toBe(403)
    const move = await keeper.post('/api/stock/move', { partId: stud.id, fromBinId: from.id, toBinId: to.id, quantity: 500 })
    expect(move.status).toBe(409)
    expect(move.body.error.code).toBe('INSUFFICIENT_STOCK')
    expect((await keeper.post('/api/stock/adjust', { partId: stud.id, binId: from.id, delta: -500, reason: 'too many' })).status).toBe(409)
    expect((await keeper.post('/api/stock/count', { binId: from.id, lines: [{ partId: stud.id, counted: -1 }] })).status).toBe(400)
    await expectUnchanged(t.dataSource, before)
  })
})

describe('two builders taking the last item at the same moment', () => {
  it('lets exactly one through (200) and refuses the other (409); the bin ends at 0', async () => {
    const stud = await partByCode(t.dataSource, 'M4X0.5-STUD')
    const bin = await binByCode(t.dataSource, 'A2-06')
    await builder.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 11 }).expect(200)
    const other = await clientAs(t.app, 'builder')
    const results = await Promise.all([builder, other].map((c) => c.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 1 })))
    expect(results.map((r) => r.status).sort()).toEqual([200, 409])
    expect(results.find((r) => r.status === 409)!.body.error.code).toBe('INSUFFICIENT_STOCK')
    expect(await qty(stud.id, 'A2-06')).toBe(0)
  })
})

describe('reservations and plain takes', () => {
  it('refuses a plain take that eats into stock held for builds, naming the builds; a storekeeper may override', async () => {
    const stud = await partByCode(t.dataSource, '6BA-STUD-20')
    const bin = await binByCode(t.dataSource, 'A1-05')
    const build = await t.dataSource.getRepository(Build).findOneByOrFail({ status: 'active' })
    const onHand = await qty(stud.id, 'A1-05')
    const held = Number((await t.dataSource.query(`SELECT COALESCE(SUM(quantity),0) AS n FROM reservations WHERE "partId" = ${Number(stud.id)}`))[0].n)
    // Hold all but 5 for the build (a fake build line id keeps clear of the build feature's own).
    await t.dataSource.getRepository(Reservation).save({ partId: stud.id, buildId: build.id, buildLineId: 900_001, quantity: onHand - held - 5, userId: 1 })
    const before = await snapshot(t.dataSource)
    const res = await builder.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 6 })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('RESERVED_FOR_BUILDS')
    expect(res.body.error.message).toContain(build.name)
    expect(res.body.error.details.available).toBe(5)
    await expectUnchanged(t.dataSource, before)
    expect((await builder.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 6, allowReserved: true, reason: 'urgent repair' })).status).toBe(403)
    expect((await keeper.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 6, allowReserved: true })).body.error.code).toBe('REASON_REQUIRED')
    await expectUnchanged(t.dataSource, before)
    const ok = await builder.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 5 })
    expect(ok.status).toBe(200)
    const over = await keeper.post('/api/stock/take', { partId: stud.id, binId: bin.id, quantity: 1, allowReserved: true, reason: 'Loco boiler repair, build can wait' })
    expect(over.status).toBe(200)
    expect(over.body.movements[0].reason).toBe('Loco boiler repair, build can wait')
    expect(await qty(stud.id, 'A1-05')).toBe(onHand - 6)
  })
})

describe('retired bins', () => {
  it('retires only an empty bin, refuses stock into a retired one, and takes it again once unretired', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const [full, empty, other] = await Promise.all(['A1-04', 'A1-12', 'A1-03'].map((c) => binByCode(t.dataSource, c)))
    const notEmpty = await keeper.post(`/api/bins/${full.id}/retire`)
    expect(notEmpty.status).toBe(409)
    expect(notEmpty.body.error.code).toBe('BIN_NOT_EMPTY')
    expect((await keeper.post(`/api/bins/${empty.id}/retire`)).body.retired).toBe(true)
    const before = await snapshot(t.dataSource)
    const receive = await keeper.post('/api/stock/receive', { partId: nut.id, binId: empty.id, quantity: 5 })
    expect(receive.status).toBe(409)
    expect(receive.body.error).toMatchObject({ code: 'BIN_RETIRED', message: 'Bin A1-12 is retired and takes no stock.' })
    const move = await keeper.post('/api/stock/move', { partId: nut.id, fromBinId: other.id, toBinId: empty.id, quantity: 5 })
    expect(move.body.error.code).toBe('BIN_RETIRED')
    expect((await builder.post('/api/stock/return', { partId: nut.id, binId: empty.id, quantity: 1 })).body.error.code).toBe('BIN_RETIRED')
    await expectUnchanged(t.dataSource, before)
    expect((await keeper.post(`/api/bins/${empty.id}/unretire`)).body.retired).toBe(false)
    expect((await keeper.post('/api/stock/move', { partId: nut.id, fromBinId: other.id, toBinId: empty.id, quantity: 5 })).status).toBe(200)
    expect(await qty(nut.id, 'A1-12')).toBe(5)
  })
})

describe('reversing a movement from the ledger', () => {
  it('writes the opposite movement, once, and refuses to reverse a reversal', async () => {
    const nut = await partByCode(t.dataSource, 'M3-NUT')
    const bin = await binByCode(t.dataSource, 'A2-04')
    const take = await builder.post('/api/stock/take', { partId: nut.id, binId: bin.id, quantity: 7 })
    const id = take.body.movements[0].id
    expect(await qty(nut.id, 'A2-04')).toBe(133)
    expect((await builder.post(`/api/movements/${id}/reverse`)).status).toBe(403)
    const res = await keeper.post(`/api/movements/${id}/reverse`, { reason: 'Took the wrong size' })
    expect(res.status).toBe(200)
    expect(res.body.movements[0]).toMatchObject({
      kind: 'draw', quantity: 7, fromBinCode: null, toBinCode: 'A2-04', reversesId: id,
      reason: `Reverses movement ${id}: Took the wrong size`,
    })
    expect(await qty(nut.id, 'A2-04')).toBe(140)
    const before = await snapshot(t.dataSource)
    expect((await keeper.post(`/api/movements/${id}/reverse`)).body.error.code).toBe('ALREADY_REVERSED')
    expect((await keeper.post(`/api/movements/${res.body.movements[0].id}/reverse`)).body.error.code).toBe('IS_REVERSAL')
    await expectUnchanged(t.dataSource, before)
    const listed = await keeper.get(`/api/movements?part=${nut.id}`)
    expect(listed.body.items.find((m: { id: number }) => m.id === id).reversedById).toBe(res.body.movements[0].id)
  })

  it('refuses to reverse a receipt whose stock has already gone, changing nothing', async () => {
    const nut = await partByCode(t.dataSource, 'M3-NUT')
    const bin = await binByCode(t.dataSource, 'A2-05')
    const rec = await keeper.post('/api/stock/receive', { partId: nut.id, binId: bin.id, quantity: 4 })
    await builder.post('/api/stock/take', { partId: nut.id, binId: bin.id, quantity: 3 }).expect(200)
    const before = await snapshot(t.dataSource)
    const res = await keeper.post(`/api/movements/${rec.body.movements[0].id}/reverse`)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('INSUFFICIENT_STOCK')
    await expectUnchanged(t.dataSource, before)
  })
})

describe('the ledger after all of the above', () => {
  it('still reconciles, and every movement has a positive quantity', async () => {
    const report = await checkLedger(t.dataSource)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
    expect(await t.dataSource.getRepository(Movement).countBy({})).toBe(report.movements)
    expect(Number((await t.dataSource.query('SELECT COUNT(*) AS n FROM movements WHERE quantity <= 0'))[0].n)).toBe(0)
    expect(await t.dataSource.getRepository(StockLot).count()).toBe(report.lots)
    expect((await lastMovement(t.dataSource)).id).toBe(report.movements)
  })
})
