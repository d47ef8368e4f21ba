import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { decodeQrIn as decodeLabel, openPdf, pageText } from '../helpers/pdf-labels'
import { binByCode } from './stock-helpers'
import { Bin, Part } from '../../server/entities'
import { findSheet, positionOf } from '../../shared/domain/label-sheets'
import type { LabelItemsDto } from '../../shared/types/labels'

/** A public address unlike the server's own, so the test proves labels use the configured one. */
const PUBLIC_URL = 'https://stores.hollindale.example'
let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client, builder: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true, config: { PUBLIC_URL } })
  ;[keeper, builder] = await Promise.all([clientAs(t.app, 'storekeeper'), clientAs(t.app, 'builder')])
})
afterAll(() => t.close())

/** POST /api/labels/pdf, answering with the raw PDF bytes. */
const pdfOf = (body: object) => keeper.post('/api/labels/pdf', body).buffer(true)
  .parse((res, done) => {
    const chunks: Buffer[] = []
    res.on('data', (c: Buffer) => chunks.push(c))
    res.on('end', () => done(null, Buffer.concat(chunks)))
  })

const codesOn = (text: string) => [...text.matchAll(/\b([A-C]\d-\d{2})\b/g)].map((m) => m[1])

describe('POST /api/labels/pdf', () => {
  it('lays a rack of 12 bins on A4 3 × 8 from position 20: 5 labels on page 1, 7 on page 2', async () => {
    const rack = (await binByCode(t.dataSource, 'A1-01')).rackId
    const res = await pdfOf({ selection: { kind: 'bin', rackId: rack }, sheetId: 'a4-3x8-70x37', startPosition: 20 })
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('application/pdf')
    expect(res.headers['x-label-count']).toBe('12')
    const doc = openPdf(res.body)
    expect(doc.countPages()).toBe(2)
    expect(codesOn(pageText(doc, 0))).toEqual(['A1-01', 'A1-02', 'A1-03', 'A1-04', 'A1-05'])
    expect(codesOn(pageText(doc, 1))).toEqual(['A1-06', 'A1-07', 'A1-08', 'A1-09', 'A1-10', 'A1-11', 'A1-12'])
  })

  it('prints a QR code that decodes to the exact bin URL under the configured public address', async () => {
    const bin = await binByCode(t.dataSource, 'A1-03')
    const sheet = findSheet('a4-5x13-38.1x21.2')!
    const res = await pdfOf({ selection: { kind: 'bin', codes: ['A1-03'] }, sheetId: sheet.id, startPosition: 7 })
    const doc = openPdf(res.body)
    expect(doc.countPages()).toBe(1)
    const at = positionOf(sheet, 7)
    const url = decodeLabel(doc, 0, { xMm: at.xMm, yMm: at.yMm, wMm: sheet.labelWidthMm, hMm: sheet.labelHeightMm })
    expect(url).toBe(`${PUBLIC_URL}/bins/${bin.labelCode}`)
    // Nothing was printed at position 1 of the partly used sheet.
    expect(decodeLabel(doc, 0, { xMm: 0, yMm: 0, wMm: 40, hMm: 30 })).toBeUndefined()
  })

  it('prints part labels whose QR opens the part by its label code, with copies side by side', async () => {
    const part = await t.dataSource.getRepository(Part).findOneByOrFail({ name: 'Thread-locker, medium strength, 10 ml' })
    const sheet = findSheet('letter-3x10-66.7x25.4')!
    const res = await pdfOf({ selection: { kind: 'part', ids: [part.id] }, sheetId: sheet.id, copies: 2 })
    const doc = openPdf(res.body)
    expect(res.headers['x-label-count']).toBe('2')
    expect(pageText(doc, 0)).toContain(part.code)
    expect(pageText(doc, 0)).toContain('SDS · gloves')
    const at = positionOf(sheet, 2)
    const url = decodeLabel(doc, 0, { xMm: at.xMm, yMm: at.yMm, wMm: sheet.labelWidthMm, hMm: sheet.labelHeightMm })
    expect(url).toBe(`${PUBLIC_URL}/parts/by-label/${part.labelCode}`)
  })

  it('fills whole pages for 240 labels (24 bins × 10 copies): 10 sheets of 24', async () => {
    const bins = await t.dataSource.getRepository(Bin).find({ order: { id: 'ASC' }, take: 24 })
    const res = await pdfOf({ selection: { kind: 'bin', ids: bins.map((b) => b.id) }, sheetId: 'a4-3x8-70x37', copies: 10 })
    expect(res.status).toBe(200)
    expect(res.headers['x-label-count']).toBe('240')
    expect(openPdf(res.body).countPages()).toBe(10)
  })

  it('lays labels on a custom grid in mm', async () => {
    const custom = { paper: 'A4', columns: 2, rows: 4, labelWidthMm: 90, labelHeightMm: 60, marginTopMm: 20, marginLeftMm: 10, gapXMm: 10, gapYMm: 5 }
    const res = await pdfOf({ selection: { kind: 'bin', codes: ['A1-01', 'A1-02', 'A1-03'] }, sheetId: 'custom', custom, startPosition: 7 })
    expect(res.status).toBe(200)
    const doc = openPdf(res.body)
    expect(doc.countPages()).toBe(2)
    expect(codesOn(pageText(doc, 0))).toEqual(['A1-01', 'A1-02'])
    expect(codesOn(pageText(doc, 1))).toEqual(['A1-03'])
  })
})

describe('refused label requests', () => {
  it('refuses codes that match nothing, naming them', async () => {
    const res = await keeper.post('/api/labels/pdf', { selection: { kind: 'bin', codes: ['A1-01', 'Z9-99'] } })
    expect(res.status).toBe(400)
    expect(res.body.error).toMatchObject({ code: 'UNKNOWN_CODES', message: 'No bin or part has the code Z9-99.' })
  })

  it('refuses a QR code too small to scan on a tiny custom label', async () => {
    const custom = { paper: 'A4', columns: 10, rows: 30, labelWidthMm: 20, labelHeightMm: 9, marginTopMm: 5, marginLeftMm: 5, gapXMm: 0, gapYMm: 0 }
    const res = await keeper.post('/api/labels/pdf', { selection: { kind: 'bin', codes: ['A1-01'] }, sheetId: 'custom', custom })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('QR_TOO_SMALL')
    expect(res.body.error.message).toMatch(/phones need at least 0.25 mm/)
    const noQr = await keeper.post('/api/labels/pdf', { selection: { kind: 'bin', codes: ['A1-01'] }, sheetId: 'custom', custom, fields: { qr: false, code: true, name: false, size: false, caution: false } })
    expect(noQr.status).toBe(200)
  })

  it('refuses a grid that does not fit its paper, a start off the sheet, and builders', async () => {
    const custom = { paper: 'Letter', columns: 3, rows: 10, labelWidthMm: 80, labelHeightMm: 25, marginTopMm: 0, marginLeftMm: 0, gapXMm: 0, gapYMm: 0 }
    const wide = await keeper.post('/api/labels/pdf', { selection: { kind: 'bin', codes: ['A1-01'] }, sheetId: 'custom', custom })
    expect(wide.status).toBe(400)
    expect(wide.body.error.message).toContain('The labels reach 240 mm across; US Letter is 215.9 mm wide.')
    const start = await keeper.post('/api/labels/pdf', { selection: { kind: 'bin', codes: ['A1-01'] }, sheetId: 'a4-3x8-70x37', startPosition: 25 })
    expect(start.status).toBe(400)
    expect(start.body.error.message).toMatch(/the sheet has 24 positions/)
    expect((await builder.post('/api/labels/pdf', { selection: { kind: 'bin', codes: ['A1-01'] } })).status).toBe(403)
  })
})

describe('POST /api/labels/items', () => {
  it('describes each bin by its part, size and cautions, in the order asked', async () => {
    const res = await keeper.post('/api/labels/items', { kind: 'bin', codes: ['C1-01', 'a1-03', 'B1-06', 'Q1-01'] })
    expect(res.status).toBe(200)
    const body = res.body as LabelItemsDto
    expect(body.unknownCodes).toEqual(['Q1-01'])
    expect(body.items.map((i) => i.code)).toEqual(['C1-01', 'A1-03', 'B1-06'])
    const [locker, nut, tube] = body.items
    expect(locker).toMatchObject({ name: 'Thread-locker, medium strength, 10 ml', detail: '10 ml', cautions: ['hazard'] })
    expect(nut).toMatchObject({ name: '7BA full nut, brass', detail: '7BA nut', cautions: [] })
    expect(nut.url).toBe(`${PUBLIC_URL}/bins/${(await binByCode(t.dataSource, 'A1-03')).labelCode}`)
    expect(tube).toMatchObject({ detail: 'tube 15 × 1 mm', cautions: ['pressure'] })
  })
})
