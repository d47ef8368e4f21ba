import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Bin, Build, BuildLine, Movement, Part, Reservation } from '../../server/entities'
import { checkLedger } from '../../server/services/ledger-check'
import { stockTotalsOf } from '../../server/services/stock-totals'
import { openShortages } from '../../server/services/shortages'
import type { BuildDetailDto, BuildLineDto } from '../../shared/types/build'

let t: Awaited<ReturnType<typeof createTestApp>>
let builder: Client, keeper: Client, viewer: Client
/** Free valve gaskets before the partial reservation, to see the release give them back. */
let gasketFree = 0
const part = async (prefix: string) => {
  const all = await t.dataSource.getRepository(Part).find()
  return all.find((p) => p.code.startsWith(prefix))!
}
const bin = (code: string) => t.dataSource.getRepository(Bin).findOneByOrFail({ code })
const reservationsOf = (buildId: number) => t.dataSource.getRepository(Reservation).findBy({ buildId })
const lineFor = (b: BuildDetailDto, partId: number) => b.lines.find((l) => l.partId === partId) as BuildLineDto

beforeAll(async () => {
  t = await createTestApp({ demo: true })
  builder = await clientAs(t.app, 'builder')
  keeper = await clientAs(t.app, 'storekeeper')
  viewer = await clientAs(t.app, 'viewer')
})
afterAll(() => t.close())

async function newBuild(c: Client, name: string, lines: { prefix: string; quantity: number; pieces?: number }[]) {
  const created = await c.post('/api/builds', { name })
  expect(created.status).toBe(201)
  let detail: BuildDetailDto = created.body
  for (const l of lines) {
    const p = await part(l.prefix)
    const res = await c.post(`/api/builds/${detail.id}/lines`, { partId: p.id, quantity: l.quantity, pieces: l.pieces ?? 1, note: l.prefix })
    expect(res.status).toBe(201)
    detail = res.body
  }
  return detail
}

describe('POST /api/builds and lines', () => {
  it('opens a planned build owned by the builder and shows each line against the stores', async () => {
    const b = await newBuild(builder, 'Beam engine', [{ prefix: '7BA-STUD-12', quantity: 10 }])
    expect(b).toMatchObject({ name: 'Beam engine', status: 'planned', ownerName: 'Nell Ashworth', canEdit: true })
    const stud = await part('7BA-STUD-12')
    expect(b.lines[0]).toMatchObject({ partCode: stud.code, quantity: 10, need: 10, reserved: 0, drawn: 0, outstanding: 10, onHand: 64, available: 64, availability: 'caution' })
  })

  it('refuses half items of a counted part and pieces on a counted line with 400', async () => {
    const b = await newBuild(builder, 'Refusals', [])
    const nut = await part('7BA-NUT')
    const half = await builder.post(`/api/builds/${b.id}/lines`, { partId: nut.id, quantity: 2.5 })
    expect(half.status).toBe(400)
    expect(half.body.error.code).toBe('BAD_LINE_QUANTITY')
    const pieces = await builder.post(`/api/builds/${b.id}/lines`, { partId: nut.id, quantity: 2, pieces: 3 })
    expect(pieces.body.error.message).toMatch(/pieces apply to bar/)
  })

  it('imports lines from CSV after a dry run that names the unknown codes', async () => {
    const b = await newBuild(builder, 'Imported', [])
    const nut = await part('7BA-NUT')
    const gsk = await part('GSK-0.4')
    const csv = `code,quantity,note\n${nut.code},8,cover nuts\n${gsk.code},2,gaskets\nNO-SUCH,3,\n`
    const dry = await builder.post(`/api/builds/${b.id}/lines/import`, { text: csv, dryRun: true })
    expect(dry.status).toBe(200)
    expect(dry.body.rows.map((r: { code: string; error: string | null }) => [r.code, r.error])).toEqual([
      [nut.code, null], [gsk.code, null], ['NO-SUCH', 'no part has the code NO-SUCH'],
    ])
    const refused = await builder.post(`/api/builds/${b.id}/lines/import`, { text: csv, dryRun: false })
    expect(refused.status).toBe(400)
    expect(await t.dataSource.getRepository(BuildLine).countBy({ buildId: b.id })).toBe(0)
    const ok = await builder.post(`/api/builds/${b.id}/lines/import`, { text: csv.replace('NO-SUCH,3,\n', ''), dryRun: false })
    expect(ok.body).toMatchObject({ added: 2, applied: true })
    const copy = await newBuild(builder, 'Copied', [])
    const copied = await builder.post(`/api/builds/${copy.id}/lines/copy`, { fromBuildId: b.id })
    expect(copied.body.copied).toBe(2)
    expect(copied.body.build.lines.map((l: BuildLineDto) => [l.partCode, l.quantity, l.note])).toEqual([
      [nut.code, 8, 'cover nuts'], [gsk.code, 2, 'gaskets'],
    ])
  })
})

describe('POST /api/builds/:id/reserve', () => {
  it('reserves a line: the build holds it and the part\'s free stock drops by it', async () => {
    const stud = await part('6BA-STUD-20')
    const before = await stockTotalsOf(stud.id)
    const b = await newBuild(builder, 'Reserve one', [{ prefix: '6BA-STUD-20', quantity: 5 }])
    const res = await builder.post(`/api/builds/${b.id}/reserve`, { lineId: b.lines[0].id })
    expect(res.status).toBe(200)
    expect(res.body.lines).toEqual([{ lineId: b.lines[0].id, partCode: stud.code, requested: 5, granted: 5, shortQuantity: 0 }])
    expect(lineFor(res.body.build, stud.id)).toMatchObject({ reserved: 5, outstanding: 0, availability: 'ok' })
    const after = await stockTotalsOf(stud.id)
    expect(after.reserved - before.reserved).toBe(5)
    expect(after.available).toBe(before.available - 5)
    const panel = await viewer.get(`/api/reservations?partId=${stud.id}`)
    expect(panel.body.items.some((r: { buildId: number; quantity: number }) => r.buildId === b.id && r.quantity === 5)).toBe(true)
  })

  it('refuses more than is free with 409 naming the shortfall, and changes nothing', async () => {
    const gsk = await part('GSK-0.4') // 6 on hand, 4 held by the demo vertical engine
    const stud = await part('7BA-STUD-16') // 18 on hand
    const b = await newBuild(builder, 'Over-reserve', [{ prefix: '7BA-STUD-16', quantity: 4 }, { prefix: 'GSK-0.4', quantity: 9 }])
    const before = await stockTotalsOf(gsk.id)
    const res = await builder.post(`/api/builds/${b.id}/reserve`, {})
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('INSUFFICIENT_STOCK')
    expect(res.body.error.message).toContain(`${gsk.code} needs 9 pcs, ${before.available} free (${9 - before.available} short)`)
    expect(res.body.error.details.lines).toEqual([{ lineId: lineFor(b, gsk.id).id, partCode: gsk.code, requested: 9, available: before.available, shortfall: 9 - before.available }])
    // The stud line fitted, but the request is one transaction: it is not held either.
    expect(await reservationsOf(b.id)).toEqual([])
    expect(await stockTotalsOf(gsk.id)).toEqual(before)
    expect((await stockTotalsOf(stud.id)).reserved).toBe(0)
    const lines = await t.dataSource.getRepository(BuildLine).findBy({ buildId: b.id })
    expect(lines.map((l) => l.shortQuantity)).toEqual([0, 0])
  })

  it('with allowPartial reserves what there is and records the rest as a shortage', async () => {
    const gsk = await part('GSK-0.4')
    const free = (await stockTotalsOf(gsk.id)).available
    gasketFree = free
    const b = await newBuild(builder, 'Partial', [{ prefix: 'GSK-0.4', quantity: free + 3 }])
    await builder.post(`/api/builds/${b.id}/status`, { status: 'active' })
    const res = await builder.post(`/api/builds/${b.id}/reserve`, { allowPartial: true })
    expect(res.status).toBe(200)
    expect(res.body.lines[0]).toMatchObject({ requested: free + 3, granted: free, shortQuantity: 3 })
    expect(lineFor(res.body.build, gsk.id)).toMatchObject({ reserved: free, shortQuantity: 3, availability: 'short' })
    expect((await stockTotalsOf(gsk.id)).available).toBe(0)
    expect(await openShortages()).toContainEqual({ partId: gsk.id, buildId: b.id, buildName: 'Partial', lineId: b.lines[0].id, shortQuantity: 3 })
    const list = await viewer.get('/api/shortages')
    expect(list.body.items).toContainEqual(expect.objectContaining({ partCode: gsk.code, buildName: 'Partial', shortQuantity: 3, available: 0 }))
    const perBuild = await viewer.get(`/api/builds/${b.id}/shortages`)
    expect(perBuild.body.total).toBe(1)
  })

  it('releases a line: the reservation and its shortage go, the stock is free again', async () => {
    const gsk = await part('GSK-0.4')
    const partial = (await t.dataSource.getRepository(Build).findOneByOrFail({ name: 'Partial' }))
    const res = await builder.post(`/api/builds/${partial.id}/release`, {})
    expect(res.status).toBe(200)
    expect(lineFor(res.body, gsk.id)).toMatchObject({ reserved: 0, shortQuantity: 0 })
    expect(await reservationsOf(partial.id)).toEqual([])
    expect((await stockTotalsOf(gsk.id)).available).toBe(gasketFree)
    expect((await openShortages()).some((s) => s.buildId === partial.id)).toBe(false)
  })
})

describe('draw and return', () => {
  it('draws a reserved line from a bin: ledger rows linked to the build, reservation down, on hand down', async () => {
    const nut = await part('6BA-NUT') // 35 in A1-06
    const b = await newBuild(builder, 'Draw', [{ prefix: '6BA-NUT', quantity: 10 }])
    await builder.post(`/api/builds/${b.id}/reserve`, {})
    const a106 = await bin('A1-06')
    const res = await builder.post(`/api/builds/${b.id}/draw`, { lineId: b.lines[0].id, binId: a106.id, quantity: 4 })
    expect(res.status).toBe(200)
    expect(lineFor(res.body.build, nut.id)).toMatchObject({ drawn: 4, reserved: 6, outstanding: 0, onHand: 31 })
    const moves = await t.dataSource.getRepository(Movement).findBy({ buildId: b.id })
    expect(moves.map((m) => [m.kind, m.quantity, m.fromBinId])).toEqual([['draw', 4, a106.id]])
    const over = await builder.post(`/api/builds/${b.id}/draw`, { lineId: b.lines[0].id, quantity: 7 })
    expect(over.status).toBe(409)
    expect(over.body.error.code).toBe('OVER_DRAW')
  })

  it('returns unused parts to a bin with a return linked to the build', async () => {
    const nut = await part('6BA-NUT')
    const b = await t.dataSource.getRepository(Build).findOneByOrFail({ name: 'Draw' })
    const line = await t.dataSource.getRepository(BuildLine).findOneByOrFail({ buildId: b.id })
    const a106 = await bin('A1-06')
    const res = await builder.post(`/api/builds/${b.id}/return`, { lineId: line.id, binId: a106.id, quantity: 1 })
    expect(res.status).toBe(200)
    expect(lineFor(res.body.build, nut.id)).toMatchObject({ drawn: 3, reserved: 6, onHand: 32 })
    const back = await t.dataSource.getRepository(Movement).findOneByOrFail({ buildId: b.id, kind: 'return' })
    expect(back).toMatchObject({ quantity: 1, toBinId: a106.id })
    const tooMany = await builder.post(`/api/builds/${b.id}/return`, { lineId: line.id, binId: a106.id, quantity: 4 })
    expect(tooMany.body.error.code).toBe('RETURN_MORE_THAN_DRAWN')
  })

  it('cuts bar pieces where the cutting plan puts them, leaving the offcut in stock', async () => {
    const bar = await part('ROUND-9.525') // one 500 mm piece
    const b = await newBuild(builder, 'Bar', [{ prefix: 'ROUND-9.525', quantity: 60, pieces: 2 }])
    const line = b.lines[0]
    // 60 + 2 × 0.5 facing + 1.5 kerf = 62.5 mm of stock per piece.
    expect(line).toMatchObject({ bar: true, stockPerPiece: 62.5, need: 125 })
    const plan = await builder.get(`/api/builds/${b.id}/lines/${line.id}/cutting-plan`)
    expect(plan.body.result.plans).toHaveLength(1)
    expect(plan.body.result.plans[0].cuts.map((c: { startMm: number; endMm: number }) => [c.startMm, c.endMm])).toEqual([[0, 61], [62.5, 123.5]])
    expect(plan.body.result.plans[0].offcutMm).toBe(375)
    await builder.post(`/api/builds/${b.id}/reserve`, {})
    const res = await builder.post(`/api/builds/${b.id}/draw`, { lineId: line.id })
    expect(res.status).toBe(200)
    expect(lineFor(res.body.build, bar.id)).toMatchObject({ piecesDrawn: 2, drawn: 125, reserved: 0, onHand: 375 })
    const moves = await t.dataSource.getRepository(Movement).find({ where: { buildId: b.id }, order: { id: 'ASC' } })
    expect(moves.map((m) => [m.kind, m.quantity])).toEqual([['draw', 61], ['adjust', 1.5], ['draw', 61], ['adjust', 1.5]])
  })
})

describe('POST /api/builds/:id/status', () => {
  it('finishing asks for confirmation with the list, then releases what is still reserved', async () => {
    const nut = await part('6BA-NUT')
    const b = await t.dataSource.getRepository(Build).findOneByOrFail({ name: 'Draw' })
    const preview = await builder.get(`/api/builds/${b.id}/release-preview`)
    expect(preview.body.lines).toEqual([expect.objectContaining({ partCode: nut.code, quantity: 6, unit: 'pcs' })])
    const unconfirmed = await builder.post(`/api/builds/${b.id}/status`, { status: 'finished' })
    expect(unconfirmed.status).toBe(409)
    expect(unconfirmed.body.error).toMatchObject({ code: 'CONFIRM_RELEASE', details: { lines: [expect.objectContaining({ quantity: 6 })] } })
    expect(await reservationsOf(b.id)).toHaveLength(1)
    const done = await builder.post(`/api/builds/${b.id}/status`, { status: 'finished', confirm: true })
    expect(done.body).toMatchObject({ status: 'finished' })
    expect(await reservationsOf(b.id)).toEqual([])
    const closed = await builder.post(`/api/builds/${b.id}/reserve`, {})
    expect(closed.body.error.code).toBe('BUILD_CLOSED')
  })
})

describe('the demo workshop', () => {
  it('has the vertical engine holding its gaskets through the builds service, and one line short', async () => {
    const vertical = await t.dataSource.getRepository(Build).findOneByOrFail({ status: 'active' })
    const detail: BuildDetailDto = (await viewer.get(`/api/builds/${vertical.id}`)).body
    expect(detail.lines.map((l) => [l.note, l.reserved, l.shortQuantity])).toEqual([
      ['cylinder cover studs', 0, 0], ['cylinder cover nuts', 0, 0], ['valve chest studs', 0, 0],
      ['cylinder cover gaskets', 4, 0], ['steam chest cover studs', 10, 6],
    ])
    expect(detail.progress).toMatchObject({ lines: 5, reservedLines: 1, shortLines: 1 })
  })
})

describe('who may change a build', () => {
  it('refuses a builder on another member\'s build with 403, and lets a storekeeper in', async () => {
    const theirs = await t.dataSource.getRepository(Build).findOneByOrFail({ name: 'Single oscillating engine for the junior section' })
    const line = await t.dataSource.getRepository(BuildLine).findOneByOrFail({ buildId: theirs.id })
    for (const [path, body] of [['reserve', {}], ['release', {}], ['draw', { lineId: line.id, pieces: 1 }], ['status', { status: 'active' }]] as const) {
      const res = await builder.post(`/api/builds/${theirs.id}/${path}`, body)
      expect(res.status, path).toBe(403)
      expect(res.body.error.code).toBe('FORBIDDEN')
    }
    expect((await builder.patch(`/api/builds/${theirs.id}`, { name: 'Mine now' })).status).toBe(403)
    expect(await reservationsOf(theirs.id)).toEqual([])
    expect((await builder.get(`/api/builds/${theirs.id}`)).body.canEdit).toBe(false)
    expect((await keeper.post(`/api/builds/${theirs.id}/reserve`, {})).status).toBe(200)
  })

  it('lets a viewer read builds but not open one', async () => {
    expect((await viewer.get('/api/builds')).status).toBe(200)
    expect((await viewer.post('/api/builds', { name: 'Nope' })).status).toBe(403)
  })

  it('leaves the ledger reconciled after all of it', async () => {
    const report = await checkLedger(t.dataSource)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
  })
})
