import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import Papa from 'papaparse'
import { clientAs, createTestApp, demoUser, type Client } from '../helpers/app'
import { Bin, Rack, Reservation, Build } from '../../server/entities'
import { binByCode, partByCode } from './stock-helpers'
import type { PlaceTreeDto } from '../../shared/types/stock'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client, builder: Client, viewer: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  ;[keeper, builder, viewer] = await Promise.all([clientAs(t.app, 'storekeeper'), clientAs(t.app, 'builder'), clientAs(t.app, 'viewer')])
})
afterAll(() => t.close())

describe('GET /api/bins', () => {
  it('answers the workshop → rack → bin tree with stocked-lot counts', async () => {
    const res = await viewer.get('/api/bins')
    expect(res.status).toBe(200)
    const tree = res.body as PlaceTreeDto
    expect(tree.workshops.map((w) => w.name)).toEqual(['Hollin Dale SME clubroom workshop'])
    const racks = tree.workshops[0].racks
    expect(racks.map((r) => r.code)).toEqual(['A1', 'A2', 'A3', 'B1', 'C1'])
    expect(racks[0].bins).toHaveLength(12)
    const b1 = racks.find((r) => r.code === 'B1')!.bins
    expect(b1.find((b) => b.code === 'B1-01')).toMatchObject({ lots: 2, rackCode: 'B1', retired: false })
    expect(b1.find((b) => b.code === 'B1-08')!.lots).toBe(0)
  })

  it('is for signed-in users only', async () => {
    const anon = await (await import('../helpers/app')).clientFor(t.app)
    expect((await anon.get('/api/bins')).status).toBe(401)
  })
})

describe('GET /api/bins/:code', () => {
  it('finds a bin by its human code in any case, or by its label code, with contents and part-level reservations', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const build = await t.dataSource.getRepository(Build).findOneByOrFail({ status: 'active' })
    const held = Number((await t.dataSource.query(`SELECT COALESCE(SUM(quantity),0) AS n FROM reservations WHERE "partId" = ${Number(nut.id)}`))[0].n)
    await t.dataSource.getRepository(Reservation).save({ partId: nut.id, buildId: build.id, buildLineId: 900_101, quantity: 24, userId: 1 })
    const res = await viewer.get('/api/bins/a1-03')
    expect(res.status).toBe(200)
    expect(res.body.bin).toMatchObject({ code: 'A1-03', rackCode: 'A1', workshopName: 'Hollin Dale SME clubroom workshop', retired: false })
    expect(res.body.lines).toEqual([expect.objectContaining({
      partId: nut.id, partCode: nut.code, kind: 'fastener', unit: 'pcs', quantity: 120, reserved: held + 24, expired: false,
      batchCode: null, hazardous: false, pressureBearing: false,
    })])
    const byLabel = await viewer.get(`/api/bins/${res.body.bin.labelCode}`)
    expect(byLabel.body.bin.code).toBe('A1-03')
  })

  it('flags expired batches and hazardous compounds', async () => {
    const res = await viewer.get('/api/bins/C1-01')
    expect(res.body.lines.map((l: { batchCode: string; expired: boolean; hazardous: boolean }) => [l.batchCode, l.expired, l.hazardous]))
      .toEqual([['TL-2211', true, true], ['TL-2307', false, true]])
  })

  it('answers 404 in the error shape for an unknown code', async () => {
    const res = await viewer.get('/api/bins/Z9-99')
    expect(res.status).toBe(404)
    expect(res.body).toEqual({ error: { code: 'NOT_FOUND', message: 'Bin Z9-99 was not found.' } })
  })
})

describe('bin upkeep (storekeepers)', () => {
  it('creates a bin with a unique code and a fresh label code, and refuses a duplicate code', async () => {
    const rack = await t.dataSource.getRepository(Rack).findOneByOrFail({ code: 'A3' })
    const res = await keeper.post('/api/bins', { code: 'a3-07', rackId: rack.id, description: 'Spare gland packing' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ code: 'A3-07', rackCode: 'A3', description: 'Spare gland packing', retired: false })
    expect(res.body.labelCode).toMatch(/^B[0-9A-Z]{8}$/)
    const dup = await keeper.post('/api/bins', { code: 'A3-07', rackId: rack.id })
    expect(dup.status).toBe(409)
    expect(dup.body.error.code).toBe('CODE_TAKEN')
    expect((await keeper.post('/api/bins', { code: 'A3 07!', rackId: rack.id })).body.error.code).toBe('INVALID_INPUT')
    expect((await builder.post('/api/bins', { code: 'A3-08', rackId: rack.id })).status).toBe(403)
  })

  it('renames a bin and moves it to another rack; the label code stays', async () => {
    const bin = await binByCode(t.dataSource, 'A3-07')
    const c1 = await t.dataSource.getRepository(Rack).findOneByOrFail({ code: 'C1' })
    const res = await keeper.patch(`/api/bins/${bin.id}`, { code: 'C1-07', rackId: c1.id })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ code: 'C1-07', rackCode: 'C1', labelCode: bin.labelCode })
    expect((await keeper.patch(`/api/bins/${bin.id}`, { code: 'C1-01' })).body.error.code).toBe('CODE_TAKEN')
    expect((await keeper.patch(`/api/bins/${bin.id}`, { rackId: 9999 })).status).toBe(404)
    expect((await t.dataSource.getRepository(Bin).findOneByOrFail({ id: bin.id })).code).toBe('C1-07')
  })

  it('creates racks and workshops, refusing duplicates', async () => {
    const w = await keeper.post('/api/workshops', { name: 'Loco shed' })
    expect(w.status).toBe(201)
    const rack = await keeper.post('/api/racks', { code: 'd1', name: 'Shelf D1', workshopId: w.body.id })
    expect(rack.body).toEqual({ id: expect.any(Number), code: 'D1', name: 'Shelf D1', workshopId: w.body.id })
    expect((await keeper.post('/api/racks', { code: 'D1', name: 'again', workshopId: w.body.id })).status).toBe(409)
    expect((await keeper.post('/api/workshops', { name: 'Loco shed' })).status).toBe(409)
    const tree = (await viewer.get('/api/bins')).body as PlaceTreeDto
    expect(tree.workshops.find((x) => x.name === 'Loco shed')!.racks.map((r) => r.code)).toEqual(['D1'])
  })
})

describe('GET /api/movements', () => {
  it('filters by part, bin, kind and user, newest first, paginated', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const a103 = await binByCode(t.dataSource, 'A1-03')
    await builder.post('/api/stock/take', { partId: nut.id, binId: a103.id, quantity: 2 }).expect(200)
    await builder.post('/api/stock/take', { partId: nut.id, binId: a103.id, quantity: 3 }).expect(200)
    const res = await viewer.get(`/api/movements?part=${nut.id}&bin=${a103.id}&pageSize=2`)
    expect(res.body).toMatchObject({ total: 3, page: 1, pageSize: 2 })
    expect(res.body.items.map((m: { kind: string; quantity: number }) => [m.kind, m.quantity])).toEqual([['draw', 3], ['draw', 2]])
    const page2 = await viewer.get(`/api/movements?part=${nut.id}&bin=${a103.id}&pageSize=2&page=2`)
    expect(page2.body.items.map((m: { kind: string; quantity: number }) => [m.kind, m.quantity])).toEqual([['receive', 120]])
    const builderId = (await builder.get('/api/auth/session')).body.user.id
    const mine = await viewer.get(`/api/movements?user=${builderId}&kind=draw`)
    expect(mine.body.total).toBe(2)
    expect(mine.body.items.every((m: { userName: string }) => m.userName === mine.body.items[0].userName)).toBe(true)
  })

  it('filters by dates (both ends included) and refuses a malformed filter with 400', async () => {
    const today = new Date().toISOString().slice(0, 10)
    const all = (await viewer.get('/api/movements?pageSize=1')).body.total
    expect((await viewer.get(`/api/movements?from=${today}&to=${today}&pageSize=1`)).body.total).toBe(all)
    expect((await viewer.get('/api/movements?to=2000-01-01')).body.total).toBe(0)
    expect((await viewer.get('/api/movements?kind=steal')).status).toBe(400)
  })

  it('exports the filtered ledger as CSV with a header row', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const res = await viewer.get(`/api/movements/export.csv?part=${nut.id}`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/^text\/csv/)
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="?binwright-ledger-\d{4}-\d{2}-\d{2}\.csv"?/)
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true })
    expect(parsed.meta.fields).toEqual(['id', 'at', 'kind', 'part_code', 'part_name', 'quantity', 'unit', 'from_bin', 'to_bin',
      'batch', 'build', 'purchase_order', 'user', 'reason', 'reverses'])
    expect(parsed.data.map((r) => [r.kind, r.quantity, r.from_bin, r.to_bin])).toEqual([
      ['draw', '3', 'A1-03', ''], ['draw', '2', 'A1-03', ''], ['receive', '30', '', 'A1-04'], ['receive', '120', '', 'A1-03'],
    ])
  })

  it('quotes a reason that a spreadsheet would run as a formula', async () => {
    const nut = await partByCode(t.dataSource, '7BA-NUT')
    const a104 = await binByCode(t.dataSource, 'A1-04')
    await keeper.post('/api/stock/adjust', { partId: nut.id, binId: a104.id, delta: 1, reason: '=HYPERLINK("x")' }).expect(200)
    const res = await viewer.get(`/api/movements/export.csv?part=${nut.id}&kind=adjust`)
    expect(res.text).toContain(`"'=HYPERLINK(""x"")"`)
  })
})

describe('GET /api/movements/people', () => {
  it('lists who has written to the ledger, by name, for any signed-in user', async () => {
    const res = await viewer.get('/api/movements/people')
    expect(res.status).toBe(200)
    const names = res.body.map((p: { displayName: string }) => p.displayName)
    // The demo's opening stock was received by the storekeeper; the builder took parts above.
    expect(names).toEqual(expect.arrayContaining([demoUser('storekeeper').displayName, demoUser('builder').displayName]))
    expect(names).toEqual([...names].sort())
  })
})
