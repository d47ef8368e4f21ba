import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { binByCode, expectUnchanged, lotsIn, partByCode, snapshot } from './stock-helpers'
import { Build, BuildLine } from '../../server/entities'
import type { DrawLineDto } from '../../shared/types/bin-page'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client, builder: Client, viewer: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  ;[keeper, builder, viewer] = await Promise.all(['storekeeper', 'builder', 'viewer'].map((r) => clientAs(t.app, r as 'viewer')))
})
afterAll(() => t.close())

const resolve = (code: string) => viewer.get(`/api/scan/resolve?code=${encodeURIComponent(code)}`)

describe('GET /api/scan/resolve', () => {
  it('opens a bin from its human code in any case, its label code, or its whole label URL', async () => {
    const bin = await binByCode(t.dataSource, 'A1-03')
    const expected = { type: 'bin', id: bin.id, code: 'A1-03', path: '/bins/A1-03' }
    expect((await resolve('A1-03')).body).toMatchObject(expected)
    expect((await resolve(' a1-03 ')).body).toMatchObject(expected)
    expect((await resolve(bin.labelCode.toLowerCase())).body).toMatchObject(expected)
    expect((await resolve(`http://localhost:3000/bins/${bin.labelCode}`)).body).toMatchObject(expected)
    // A label printed under an older public address still opens the bin.
    expect((await resolve(`https://old-stores.example/bins/${bin.labelCode}`)).body).toMatchObject(expected)
  })

  it('opens a part from its label URL, its label code or its part code', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const expected = { type: 'part', id: nut.id, code: nut.code, path: `/parts/${nut.id}` }
    expect((await resolve(`http://localhost:3000/parts/by-label/${nut.labelCode}`)).body).toMatchObject(expected)
    expect((await resolve(nut.labelCode)).body).toMatchObject(expected)
    expect((await resolve(nut.code.toLowerCase())).body).toMatchObject(expected)
  })

  it('says "not one of our labels" for anything else, with 404 NOT_OUR_LABEL', async () => {
    for (const code of ['Z9-99', '5012345678900', 'https://example.com/products/12', 'http://localhost:3000/bins/NOPE']) {
      const res = await resolve(code)
      expect(res.status).toBe(404)
      expect(res.body.error.code).toBe('NOT_OUR_LABEL')
      expect(res.body.error.message).toBe(`“${code}” is not one of our labels.`)
    }
    expect((await resolve('')).status).toBe(400)
  })

  it('needs a signed-in user', async () => {
    const { clientFor } = await import('../helpers/app')
    const anon = await clientFor(t.app)
    expect((await anon.get('/api/scan/resolve?code=A1-03')).status).toBe(401)
  })
})

describe('GET /api/scan/bins/:id/draw-lines', () => {
  it('lists the builder\'s open lines that need a part in the bin, with what is still to draw', async () => {
    const bin = await binByCode(t.dataSource, 'A1-03')
    const res = await builder.get(`/api/scan/bins/${bin.id}/draw-lines`)
    expect(res.status).toBe(200)
    const lines = res.body as DrawLineDto[]
    expect(lines).toHaveLength(1)
    expect(lines[0]).toMatchObject({ buildName: 'Single-cylinder vertical engine, 7/8 in bore', note: 'cylinder cover nuts', open: 24, mine: true, bar: false })
  })

  it('shows a viewer with no builds nothing, and a storekeeper every open build', async () => {
    const bin = await binByCode(t.dataSource, 'A1-03')
    expect((await viewer.get(`/api/scan/bins/${bin.id}/draw-lines`)).body).toEqual([])
    const all = (await keeper.get(`/api/scan/bins/${bin.id}/draw-lines`)).body as DrawLineDto[]
    expect(all.map((l) => [l.note, l.mine])).toEqual([['cylinder cover nuts', false]])
  })

  it('drops lines already drawn in full', async () => {
    const bin = await binByCode(t.dataSource, 'A1-05')
    const build = await t.dataSource.getRepository(Build).findOneByOrFail({ name: 'Single-cylinder vertical engine, 7/8 in bore' })
    const line = await t.dataSource.getRepository(BuildLine).findOneByOrFail({ buildId: build.id, note: 'valve chest studs' })
    const draw = await builder.post(`/api/builds/${build.id}/draw`, { lineId: line.id, binId: bin.id, quantity: 12 })
    expect(draw.status).toBe(200)
    expect((await builder.get(`/api/scan/bins/${bin.id}/draw-lines`)).body).toEqual([])
  })
})

describe('POST /api/stocktake/apply', () => {
  it('applies the differences of several bins together, and writes nothing for equal counts', async () => {
    const [studs, nuts] = await Promise.all([partByCode(t.dataSource, '7BA-STUD-12'), partByCode(t.dataSource, '6BA-NUT')])
    const [a1, a6] = await Promise.all([binByCode(t.dataSource, 'A1-01'), binByCode(t.dataSource, 'A1-06')])
    const [studLot] = await lotsIn(t.dataSource, studs.id, a1.id)
    const [nutLot] = await lotsIn(t.dataSource, nuts.id, a6.id)
    const res = await keeper.post('/api/stocktake/apply', {
      reason: 'Spring stock-take, rack A1',
      bins: [
        { binId: a1.id, lines: [{ lotId: studLot.id, expected: 64, counted: 61 }] },
        { binId: a6.id, lines: [{ lotId: nutLot.id, expected: 35, counted: 35 }] },
      ],
    })
    expect(res.status).toBe(200)
    expect(res.body.bins).toBe(2)
    expect(res.body.movements).toHaveLength(1)
    expect(res.body.movements[0]).toMatchObject({ kind: 'count', quantity: 3, fromBinCode: 'A1-01', reason: 'Spring stock-take, rack A1' })
    expect((await lotsIn(t.dataSource, studs.id, a1.id))[0].quantity).toBe(61)
  })

  it('refuses the whole stock-take with 409 COUNT_STALE when stock moved after a bin was counted', async () => {
    const [studs, nuts] = await Promise.all([partByCode(t.dataSource, '7BA-STUD-12'), partByCode(t.dataSource, '5BA-NUT')])
    const [a1, a8] = await Promise.all([binByCode(t.dataSource, 'A1-01'), binByCode(t.dataSource, 'A1-08')])
    const [studLot] = await lotsIn(t.dataSource, studs.id, a1.id)
    const [nutLot] = await lotsIn(t.dataSource, nuts.id, a8.id)
    // Counted at 61 on the sheet; then a builder takes two before the storekeeper applies.
    expect((await builder.post('/api/stock/take', { partId: studs.id, binId: a1.id, quantity: 2 })).status).toBe(200)
    const before = await snapshot(t.dataSource)
    const res = await keeper.post('/api/stocktake/apply', {
      bins: [
        { binId: a8.id, lines: [{ lotId: nutLot.id, expected: 60, counted: 58 }] },
        { binId: a1.id, lines: [{ lotId: studLot.id, expected: 61, counted: 60 }] },
      ],
    })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('COUNT_STALE')
    expect(res.body.error.message).toBe('Stock moved in A1-01 after it was counted; count that bin again. Nothing was changed.')
    expect(res.body.error.details).toEqual([{ binId: a1.id, binCode: 'A1-01', lotId: studLot.id, partCode: studs.code, expected: 61, now: 59 }])
    await expectUnchanged(t.dataSource, before)
  })

  it('refuses a count into a retired bin and a viewer, changing nothing', async () => {
    const bin = await binByCode(t.dataSource, 'A2-10')
    const washer = await partByCode(t.dataSource, '7BA-WASHER')
    expect((await keeper.post(`/api/bins/${bin.id}/retire`)).status).toBe(200)
    const before = await snapshot(t.dataSource)
    const res = await keeper.post('/api/stocktake/apply', { bins: [{ binId: bin.id, lines: [{ partId: washer.id, counted: 5 }] }] })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('BIN_RETIRED')
    expect((await viewer.post('/api/stocktake/apply', { bins: [{ binId: bin.id, lines: [] }] })).status).toBe(403)
    await expectUnchanged(t.dataSource, before)
  })
})
