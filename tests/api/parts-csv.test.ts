import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import Papa from 'papaparse'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Movement, Part, StockLot } from '../../server/entities'
import { checkLedger } from '../../server/services/ledger-check'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client
let viewer: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  ;[keeper, viewer] = await Promise.all([clientAs(t.app, 'storekeeper'), clientAs(t.app, 'viewer')])
}, 60_000)
afterAll(() => t.close())

const partCount = () => t.dataSource.getRepository(Part).count()
const csv = (lines: string[]) => lines.join('\n')
const sendCsv = (url: string, text: string, dryRun: boolean) =>
  keeper.agent.post(`${url}?dryRun=${dryRun}`).set('x-csrf-token', keeper.token).set('content-type', 'text/csv').send(text)

describe('parts CSV', () => {
  it('exports every live part with attributes in their own columns', async () => {
    const res = await viewer.get('/api/parts/export.csv').expect(200)
    expect(res.headers['content-type']).toMatch(/text\/csv/)
    const rows = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true }).data
    expect(rows).toHaveLength(await partCount())
    expect(rows.find((r) => r.code === '7BA-STUD-12-BR')).toMatchObject({ kind: 'fastener', type: 'stud', thread: '7BA', lengthMm: '12', material: 'brass', tags: 'studding' })
    expect(rows.find((r) => r.code === 'COM-THREADLOCKER')).toMatchObject({ hazardous: 'yes', containerSize: '10 ml' })
    expect(rows.find((r) => r.code === 'OTH-WHISTLEVALVE')).toMatchObject({ properties: 'material=gunmetal LG2; use=boiler fitting', pressureBearing: 'yes' })
  })

  it('reads its own export back as updates with no errors', async () => {
    const exported = (await viewer.get('/api/parts/export.csv').expect(200)).text
    const res = await sendCsv('/api/parts/import', exported, true).expect(200)
    expect(res.body).toMatchObject({ dryRun: true, applied: false, errors: [], created: 0, updated: await partCount() })
  })

  const BAD = csv([
    'code,name,kind,type,thread,lengthMm,material,section,sizeMm,thicknessMm,reorderPoint',
    ',10BA stud 8 mm,fastener,stud,10BA,8,brass,,,,10', // line 2: fine
    ',Bad thread stud,fastener,stud,M3x0.4,10,brass,,,,', // line 3: thread
    '',
    ',Oval bar,stock,,,,brass,oval,10,,', // line 5: section
    ',Gasket,gasket,,,,paper,,,thick,', // line 6: thicknessMm
    ',Thing,widget,,,,,,,,', // line 7: kind
    'DUP-1,First,other,,,,,,,,', // line 8
    'DUP-1,Second,other,,,,,,,,abc', // line 9: reorderPoint and code
  ])

  it('dry run lists each row\'s errors by line and column and writes nothing', async () => {
    const before = await partCount()
    const res = await sendCsv('/api/parts/import', BAD, true).expect(200)
    const found = res.body.errors.map((e: { line: number; column: string }) => `${e.line}:${e.column}`)
    expect(found).toEqual(['3:thread', '5:section', '6:thicknessMm', '7:kind', '9:reorderPoint'])
    expect(res.body.errors[0].message).toMatch(/0\.5 mm coarse pitch or 0\.35 mm fine/)
    expect(res.body).toMatchObject({ rows: 7, created: 2, applied: false })
    expect(await partCount()).toBe(before)
  })

  it('flags a code used twice in the file', async () => {
    const res = await sendCsv('/api/parts/import', csv(['code,name,kind', 'DUP-1,First,other', 'DUP-1,Second,other']), true).expect(200)
    expect(res.body.errors).toEqual([{ line: 3, column: 'code', message: 'DUP-1 is also on line 2' }])
  })

  it('applies all or nothing: one bad row and no part is created', async () => {
    const before = await partCount()
    const res = await sendCsv('/api/parts/import', BAD, false).expect(400)
    expect(res.body.error.code).toBe('CSV_INVALID')
    expect(res.body.error.details.errors).toHaveLength(5)
    expect(await partCount()).toBe(before)
  })

  it('applies a good file in one go, creating and updating', async () => {
    const before = await partCount()
    const good = csv([
      'code,name,kind,type,thread,lengthMm,material,reorderPoint,tags',
      ',10BA stud 8 mm,fastener,stud,10ba,8,brass,10,studding; small',
      '7BA-NUT-BR,7BA full nut (brass),fastener,nut,7BA,,brass,60,',
    ])
    const res = await sendCsv('/api/parts/import', good, false).expect(200)
    expect(res.body).toMatchObject({ applied: true, created: 1, updated: 1, errors: [] })
    expect(await partCount()).toBe(before + 1)
    const made = await t.dataSource.getRepository(Part).findOneByOrFail({ code: '10BA-STUD-8-BR' })
    expect(made).toMatchObject({ threadKey: '10BA', reorderPoint: 10, tags: ['studding', 'small'] })
    const nut = await t.dataSource.getRepository(Part).findOneByOrFail({ code: '7BA-NUT-BR' })
    // Blank cells keep what the part had: its preferred supplier and head stay.
    expect(nut).toMatchObject({ name: '7BA full nut (brass)', reorderPoint: 60, attributes: { head: 'hex' } })
    expect(nut.preferredSupplierId).not.toBeNull()
  })

  it('refuses the import to viewers (403)', async () => {
    await viewer.post('/api/parts/import', { csv: 'code,name,kind', dryRun: true }).expect(403)
  })
})

describe('stock levels CSV', () => {
  it('exports one row per lot, bar pieces and batches separately', async () => {
    const text = (await viewer.get('/api/stock-levels/export.csv').expect(200)).text
    const rows = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true }).data
    expect(rows.filter((r) => r.partCode === 'HEX-6.35-BR').map((r) => [r.binCode, r.quantity])).toEqual([['B1-01', '1000'], ['B1-01', '310']])
    expect(rows.filter((r) => r.partCode === 'COM-THREADLOCKER').map((r) => r.batchCode)).toEqual(['TL-2211', 'TL-2307'])
  })

  it('dry run lists errors by line and column', async () => {
    const text = csv([
      'partCode,binCode,quantity,lotId,batchCode,expiresOn',
      '7BA-NUT-BR,A1-03,100,,,',
      'NO-SUCH-PART,A1-03,1,,,',
      '7BA-NUT-BR,Z9-99,1,,,',
      '7BA-NUT-BR,A1-04,2.5,,,',
      'COM-THREADLOCKER,C1-01,1,,,',
      '7BA-NUT-BR,A1-03,-4,,,',
    ])
    const res = await sendCsv('/api/stock-levels/import', text, true).expect(200)
    expect(res.body.errors.map((e: { line: number; column: string }) => `${e.line}:${e.column}`))
      .toEqual(['3:partCode', '4:binCode', '5:quantity', '6:batchCode', '7:quantity'])
  })

  it('applies counts as ledger movements in one transaction, or nothing', async () => {
    const nut = await t.dataSource.getRepository(Part).findOneByOrFail({ code: '7BA-NUT-BR' })
    const moves = () => t.dataSource.getRepository(Movement).count()
    const before = await moves()
    await sendCsv('/api/stock-levels/import', csv(['partCode,binCode,quantity', '7BA-NUT-BR,A1-03,100', '7BA-NUT-BR,Z9-99,1']), false).expect(400)
    expect(await moves()).toBe(before)
    const res = await sendCsv('/api/stock-levels/import', csv(['partCode,binCode,quantity', '7BA-NUT-BR,A1-03,100', '7BA-NUT-BR,A1-12,7']), false).expect(200)
    expect(res.body).toMatchObject({ applied: true, updated: 1, created: 1 })
    const lots = await t.dataSource.getRepository(StockLot).find({ where: { partId: nut.id }, relations: { bin: true } })
    expect(Object.fromEntries(lots.map((l) => [l.bin.code, l.quantity]))).toEqual({ 'A1-03': 100, 'A1-04': 30, 'A1-12': 7 })
    const last = await t.dataSource.getRepository(Movement).find({ order: { id: 'DESC' }, take: 2 })
    expect(last.map((m) => [m.kind, m.quantity, m.reason])).toEqual([
      ['count', 7, 'Stock levels imported from CSV'], ['count', 20, 'Stock levels imported from CSV'],
    ])
    expect(await checkLedger(t.dataSource)).toMatchObject({ differences: [], negativeLots: 0 })
  })
})
