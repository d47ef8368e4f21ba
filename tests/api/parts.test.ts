import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Part } from '../../server/entities'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client
let viewer: Client
let builder: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  ;[keeper, viewer, builder] = await Promise.all([clientAs(t.app, 'storekeeper'), clientAs(t.app, 'viewer'), clientAs(t.app, 'builder')])
}, 60_000)
afterAll(() => t.close())

const codesFor = async (q: string, extra = '') =>
  (await viewer.get(`/api/parts?q=${encodeURIComponent(q)}${extra}`).expect(200)).body.items.map((p: { code: string }) => p.code)

describe('POST /api/parts', () => {
  it('creates a fastener with its thread written the standard way, indexed by thread key, code suggested', async () => {
    const res = await keeper.post('/api/parts', {
      name: '8BA stud 10 mm, phosphor bronze',
      attributes: { kind: 'fastener', type: 'stud', thread: '8 ba', lengthMm: 10, material: 'PB' },
    }).expect(201)
    expect(res.body).toMatchObject({
      code: '8BA-STUD-10-PB', kind: 'fastener', form: 'stud', threadKey: '8BA', lengthMm: 10,
      material: 'phosphor bronze', unit: 'pcs', onHand: 0, reserved: 0, available: 0,
      attributes: { thread: '8BA', material: 'PB' }, hasMovements: false, lots: [],
    })
    expect(res.body.labelCode).toMatch(/^P[0-9A-Z]{8}$/)
  })

  it('gives M3 and m3 x 0.5 the same thread key', async () => {
    const a = await keeper.post('/api/parts', { name: 'M3 wing nut', attributes: { kind: 'fastener', type: 'nut', thread: 'M3', material: 'brass' } }).expect(201)
    const b = await keeper.post('/api/parts', { name: 'M3 dome nut', attributes: { kind: 'fastener', type: 'nut', thread: 'm3 x 0.5', material: 'brass' } }).expect(201)
    expect([a.body.threadKey, b.body.threadKey]).toEqual(['M3x0.5', 'M3x0.5'])
    expect(b.body.code).toBe('M3-NUT-BR-2') // the suggested code was taken by the first: "-2"
  })

  it.each([
    ['gasket', { kind: 'gasket', material: 'compressed fibre', thicknessMm: 0.8 }, { code: 'GSK-0.8-FIB', sizeMm: 0.8, unit: 'pcs' }],
    ['stock', { kind: 'stock', material: 'BMS', section: 'square', sizeMm: 12.7 }, { code: 'SQUARE-12.7-MS', form: 'square', sizeMm: 12.7, material: 'mild steel', unit: 'mm' }],
    ['compound', { kind: 'compound', grade: 'high-temperature jointing compound', containerSize: '85 g', hazardous: true }, { hazardous: true, unit: 'each' }],
    ['other', { kind: 'other', properties: { material: 'gunmetal', use: 'safety valve body' } }, { material: 'gunmetal', code: 'OTH-SAFETYVALVEB' }],
  ])('creates a %s with its search columns', async (_kind, attributes, expected) => {
    const res = await keeper.post('/api/parts', { name: 'Safety valve body', attributes }).expect(201)
    expect(res.body).toMatchObject({ kind: attributes.kind, ...expected })
  })

  it.each([
    ['fastener, unknown thread', { kind: 'fastener', type: 'stud', thread: 'M3x0.4', material: 'brass' }, 'attributes.thread'],
    ['fastener, no material', { kind: 'fastener', type: 'nut', thread: '7BA', material: '' }, 'attributes.material'],
    ['fastener, unknown type', { kind: 'fastener', type: 'rivet', thread: '7BA', material: 'brass' }, 'attributes.type'],
    ['gasket, negative thickness', { kind: 'gasket', material: 'paper', thicknessMm: -1 }, 'attributes.thicknessMm'],
    ['stock, unknown section', { kind: 'stock', material: 'brass', section: 'oval', sizeMm: 10 }, 'attributes.section'],
    ['stock, 20 m bar', { kind: 'stock', material: 'brass', section: 'round', sizeMm: 20_000 }, 'attributes.sizeMm'],
    ['compound, no grade', { kind: 'compound', grade: '', containerSize: '10 ml' }, 'attributes.grade'],
    ['other, value too long', { kind: 'other', properties: { note: 'x'.repeat(200) } }, 'attributes.properties.note'],
  ])('refuses a %s with 400 naming the field', async (_what, attributes, field) => {
    const before = await t.dataSource.getRepository(Part).count()
    const res = await keeper.post('/api/parts', { name: 'Wrong part', attributes }).expect(400)
    expect(res.body.error.code).toBe('INVALID_INPUT')
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field)
    expect(await t.dataSource.getRepository(Part).count()).toBe(before)
  })

  it('explains an unknown thread and suggests real ones', async () => {
    const res = await keeper.post('/api/parts', { name: 'x', attributes: { kind: 'fastener', type: 'nut', thread: '17BA', material: 'brass' } }).expect(400)
    expect(res.body.error.message).toMatch(/0BA to 16BA/)
    expect(res.body.error.details[0].suggestions).toContain('16BA')
  })

  it('refuses a code already used with 409 CODE_TAKEN', async () => {
    const res = await keeper.post('/api/parts', { code: '7ba-nut-br', name: 'Another nut', attributes: { kind: 'fastener', type: 'nut', thread: '7BA', material: 'brass' } }).expect(409)
    expect(res.body.error).toMatchObject({ code: 'CODE_TAKEN', details: { field: 'code' } })
  })

  it('refuses viewers and builders with 403', async () => {
    const body = { name: 'Nut', attributes: { kind: 'fastener', type: 'nut', thread: '7BA', material: 'brass' } }
    expect((await viewer.post('/api/parts', body).expect(403)).body.error.code).toBe('FORBIDDEN')
    await builder.post('/api/parts', body).expect(403)
    await viewer.post('/api/parts/1/archive').expect(403)
  })

  it('suggests a free code from the attributes', async () => {
    const res = await keeper.post('/api/parts/suggest-code', { name: '', attributes: { kind: 'fastener', type: 'nut', thread: '7ba', material: 'brass' } }).expect(200)
    expect(res.body.code).toBe('7BA-NUT-BR-2')
  })
})

describe('PATCH /api/parts/:id', () => {
  it('edits a part, keeping its code when none is sent, and re-indexes it', async () => {
    const made = await keeper.post('/api/parts', { name: 'Brass round 5 mm', attributes: { kind: 'stock', material: 'brass', section: 'round', sizeMm: 5 } }).expect(201)
    const res = await keeper.patch(`/api/parts/${made.body.id}`, { name: 'Brass hex 5 mm', attributes: { kind: 'stock', material: 'brass', section: 'hex', sizeMm: 5 }, tags: ['valve spindles'] }).expect(200)
    expect(res.body).toMatchObject({ code: made.body.code, name: 'Brass hex 5 mm', form: 'hex', tags: ['valve spindles'] })
    expect(await codesFor('brass hex 5')).toEqual([made.body.code])
  })

  it('finds a part by the words of its new name at once, and no longer by the old ones', async () => {
    const made = await keeper.post('/api/parts', { name: 'Snifting valve body', attributes: { kind: 'other', properties: {} } }).expect(201)
    expect(await codesFor('snifting')).toEqual([made.body.code])
    expect(await codesFor('valve')).toContain(made.body.code)
    await keeper.patch(`/api/parts/${made.body.id}`, { name: 'Blowdown cock body', attributes: { kind: 'other', properties: {} } }).expect(200)
    expect(await codesFor('blowdown')).toEqual([made.body.code])
    expect(await codesFor('valve')).not.toContain(made.body.code) // (its code, kept, still reads SNIFTINGVALV)
  })

  it('refuses to change the kind of a part that has stock (409 KIND_LOCKED)', async () => {
    const part = await t.dataSource.getRepository(Part).findOneByOrFail({ code: '7BA-NUT-BR' })
    const res = await keeper.patch(`/api/parts/${part.id}`, { name: 'x', attributes: { kind: 'other', properties: {} } }).expect(409)
    expect(res.body.error.code).toBe('KIND_LOCKED')
  })
})

describe('GET /api/parts (search the demo catalogue)', () => {
  it.each([
    ['7ba nut', ['7BA-NUT-BR']],
    ['7BA', ['7BA-NUT-BR', '7BA-STUD-12-BR', '7BA-STUD-16-SS303', '7BA-WASHER-BR']],
    ['m3 x 12 stainless', ['M3-SCREW-12-SSA2']],
    ['M4x0.5', ['M4X0.5-STUD-16-BR']],
    ['5/32-40 stud', ['5/32-40ME-STUD-20-SS303']],
    ['1/4 unc', ['1/4-20UNC-BOLT-25.4-SS304']],
    ['brass hex 1/4', ['HEX-6.35-BR']],
    ['3/8 round bms', ['ROUND-9.525-MS']],
    ['3/8 round', ['ROUND-9.525-BR', 'ROUND-9.525-MS']],
    ['gasket 0.4', ['GSK-0.4-FIB']],
    ['pb round 16', ['ROUND-16-PB']],
    ['copper tube', ['TUBE-15-CU']],
    ['whistel valve', ['OTH-WHISTLEVALVE']],
  ])('finds %j', async (q, codes) => {
    expect(await codesFor(q)).toEqual(codes)
  })

  it('reads "gm" as gunmetal and ranks the casting first among gunmetal parts', async () => {
    const codes = await codesFor('gm casting')
    expect(codes[0]).toBe('OTH-WHISTLEVALVE')
    expect(codes).toContain('OTH-SAFETYVALVEB') // made above with properties.material gunmetal
  })

  it('ranks the thread-locker first for "thread locker", among compounds only', async () => {
    const res = await viewer.get('/api/parts?q=thread%20locker').expect(200)
    expect(res.body.items[0].code).toBe('COM-THREADLOCKER')
    expect(res.body.items.every((p: { kind: string }) => p.kind === 'compound')).toBe(true)
    expect(res.body.understood).toEqual({ kind: 'compound', text: 'thread locker' })
  })

  it('still finds parts through typing errors (studd, bras)', async () => {
    const studs = await codesFor('studd')
    expect(studs).toContain('7BA-STUD-12-BR')
    expect(studs.every((c: string) => c.includes('-STUD-'))).toBe(true)
    const brass = await codesFor('bras', '&pageSize=100')
    expect(brass).toEqual(expect.arrayContaining(['7BA-NUT-BR', 'HEX-6.35-BR', 'ROUND-9.525-BR']))
    expect(brass).not.toContain('7BA-STUD-16-SS303')
  })

  it('finds a part by its exact code or label code (a scanned QR)', async () => {
    const part = await t.dataSource.getRepository(Part).findOneByOrFail({ code: 'GSK-0.4-FIB' })
    expect(await codesFor('gsk-0.4-fib')).toEqual(['GSK-0.4-FIB'])
    expect(await codesFor(part.labelCode)).toEqual(['GSK-0.4-FIB'])
  })

  it('answers with on hand, reserved and available per row and paginates', async () => {
    const res = await viewer.get('/api/parts?q=7ba%20nut').expect(200)
    expect(res.body.items[0]).toMatchObject({ code: '7BA-NUT-BR', onHand: 150, unit: 'pcs', threadKey: '7BA' })
    expect(res.body.items[0].available).toBe(res.body.items[0].onHand - res.body.items[0].reserved)
    const p1 = await viewer.get('/api/parts?pageSize=10&page=1').expect(200)
    const p2 = await viewer.get('/api/parts?pageSize=10&page=2').expect(200)
    expect(p1.body).toMatchObject({ page: 1, pageSize: 10, total: p2.body.total })
    expect(p1.body.items).toHaveLength(10)
    expect(p1.body.items.map((p: { id: number }) => p.id)).not.toContain(p2.body.items[0].id)
  })

  it('filters by kind', async () => {
    const res = await viewer.get('/api/parts?kind=gasket&pageSize=100').expect(200)
    expect(res.body.items.map((p: { code: string }) => p.code)).toEqual(expect.arrayContaining(['GSK-0.25-PAP', 'GSK-0.4-FIB', 'GSK-1.5-PTFE']))
    expect(res.body.items.every((p: { kind: string }) => p.kind === 'gasket')).toBe(true)
  })

  it('refuses a page size over 100 with 400', async () => {
    expect((await viewer.get('/api/parts?pageSize=500').expect(400)).body.error.code).toBe('INVALID_INPUT')
  })

  it('needs a sign-in', async () => {
    const { clientFor } = await import('../helpers/app')
    const anon = await clientFor(t.app)
    expect((await anon.get('/api/parts').expect(401)).body.error.code).toBe('SIGN_IN_REQUIRED')
  })
})

describe('archive, restore and delete', () => {
  it('hides an archived part from search (unless asked) and restores it', async () => {
    const part = await t.dataSource.getRepository(Part).findOneByOrFail({ code: 'TUBE-15-CU' })
    expect((await keeper.post(`/api/parts/${part.id}/archive`).expect(200)).body.archived).toBe(true)
    expect(await codesFor('copper tube')).toEqual([])
    expect(await codesFor('copper')).toEqual([])
    expect(await codesFor('copper tube', '&includeArchived=true')).toEqual(['TUBE-15-CU'])
    await keeper.post(`/api/parts/${part.id}/restore`).expect(200)
    expect(await codesFor('copper tube')).toEqual(['TUBE-15-CU'])
  })

  it('never deletes a part with movements (409 PART_IN_USE), but deletes one entered by mistake', async () => {
    const used = await t.dataSource.getRepository(Part).findOneByOrFail({ code: '7BA-NUT-BR' })
    const res = await keeper.delete(`/api/parts/${used.id}`).expect(409)
    expect(res.body.error).toMatchObject({ code: 'PART_IN_USE' })
    expect(res.body.error.details.used).toContain('ledger movements')
    const made = await keeper.post('/api/parts', { name: 'Typo part', attributes: { kind: 'other', properties: {} } }).expect(201)
    await keeper.delete(`/api/parts/${made.body.id}`).expect(204)
    await viewer.get(`/api/parts/${made.body.id}`).expect(404)
  })
})

describe('GET /api/parts/:id and by-label', () => {
  it('shows a bar part\'s pieces per bin and a batch part\'s expired batch', async () => {
    const hex = await t.dataSource.getRepository(Part).findOneByOrFail({ code: 'HEX-6.35-BR' })
    const bar = (await viewer.get(`/api/parts/${hex.id}`).expect(200)).body
    expect(bar.lots.map((l: { binCode: string; quantity: number }) => [l.binCode, l.quantity])).toEqual([['B1-01', 1000], ['B1-01', 310]])
    expect(bar).toMatchObject({ onHand: 1310, unit: 'mm', hasMovements: true })
    const tl = await t.dataSource.getRepository(Part).findOneByOrFail({ code: 'COM-THREADLOCKER' })
    const locker = (await viewer.get(`/api/parts/by-label/${tl.labelCode}`).expect(200)).body
    expect(locker).toMatchObject({ hazardous: true, onHand: 3 })
    expect(locker.lots.map((l: { batchCode: string; expired: boolean }) => [l.batchCode, l.expired])).toEqual([['TL-2211', true], ['TL-2307', false]])
  })

  it('answers 404 for an unknown part or label', async () => {
    expect((await viewer.get('/api/parts/99999').expect(404)).body.error.code).toBe('NOT_FOUND')
    await viewer.get('/api/parts/by-label/PNOSUCH00').expect(404)
  })
})
