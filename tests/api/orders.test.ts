import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as mupdf from 'mupdf'
import { clientAs, createTestApp, demoUser, type Client } from '../helpers/app'
import { parseMail } from '../helpers/mail'
import { smallStore, stockedPart } from '../helpers/stores'
import { startMailSink, type MailSink } from '../../server/services/mail-sink'
import { settle } from '../../server/services/alerts'
import { todayIso } from '../../server/services/stock-guards'
import { Movement, User, type Bin, type Part, type Supplier } from '../../server/entities'

let t: Awaited<ReturnType<typeof createTestApp>>
let sink: MailSink
let keeper: Client
let nut: Part
let oil: Part
let bins: Bin[]
let supplier: Supplier
let orderId: number
let lineOf: (partId: number) => number

beforeAll(async () => {
  sink = await startMailSink()
  t = await createTestApp({ config: { SMTP_HOST: sink.host, SMTP_PORT: sink.port, PUBLIC_URL: 'http://stores.test' } })
  const keeperUser = await t.dataSource.getRepository(User).findOneByOrFail({ username: demoUser('storekeeper').username })
  const store = await smallStore(keeperUser.id)
  bins = store.bins
  supplier = store.supplier
  // 50 nuts at 0.08 each, reorder at 40, reorder quantity 100, packs of 25 at 2.50 (0.10 each).
  nut = await stockedPart({
    name: '6BA full nut, brass', attributes: { kind: 'fastener', type: 'nut', thread: '6BA', material: 'brass' },
    reorderPoint: 40, reorderQuantity: 100, unitCost: 0.08,
  }, { supplierId: supplier.id, binId: bins[0].id, quantity: 50, packSize: 25, packPrice: 2.5, userId: keeperUser.id })
  // 2 tins of steam oil, reorder at 2 (so low from the start), reorder quantity 3, single tins at 9.00.
  oil = await stockedPart({
    name: 'Steam cylinder oil, 500 ml', unit: 'tin', reorderPoint: 2, reorderQuantity: 3, unitCost: 9,
    attributes: { kind: 'compound', grade: 'steam cylinder oil', containerSize: '500 ml' },
  }, { supplierId: supplier.id, binId: bins[1].id, quantity: 2, packSize: 1, packPrice: 9, userId: keeperUser.id, expiresOn: '2031-01-31' })
  await settle()
  keeper = await clientAs(t.app, 'storekeeper')
})
afterAll(async () => {
  await t.close()
  await sink.close()
})

const supply = async (p: Part) => (await keeper.get(`/api/parts/${p.id}/supply`)).body.part
const openAlertKeys = async () => ((await keeper.get('/api/alerts')).body.items as { key: string }[]).map((a) => a.key).sort()

describe('a purchase order from suggestion to received', () => {
  it('suggests the low parts in whole packs, grouped under their preferred supplier', async () => {
    expect((await keeper.post('/api/stock/take', { partId: nut.id, binId: bins[0].id, quantity: 10, reason: 'test' })).status).toBe(200)
    expect(await openAlertKeys()).toEqual([`low-stock:${nut.id}`, `low-stock:${oil.id}`].sort())
    const res = await keeper.get('/api/orders/suggestions')
    expect(res.status).toBe(200)
    expect(res.body).toHaveLength(1)
    const [group] = res.body
    expect(group).toMatchObject({ supplierId: supplier.id, supplierName: 'Calder Fixings (invented)', total: 37 })
    const byPart = Object.fromEntries(group.lines.map((l: { partId: number }) => [l.partId, l]))
    // Nut: 40 available ≤ 40 → the reorder quantity 100 = 4 packs of 25 at 2.50 = 10.00.
    expect(byPart[nut.id]).toMatchObject({ available: 40, onOrder: 0, packs: 4, quantity: 100, lineCost: 10, reasons: ['low-stock'] })
    // Oil: 2 available ≤ 2 → the reorder quantity 3 = 3 single tins at 9.00 = 27.00.
    expect(byPart[oil.id]).toMatchObject({ available: 2, packs: 3, quantity: 3, lineCost: 27 })
  })

  it('makes a draft from the suggestion, numbered PO-0001; the suggestion then counts it as on order', async () => {
    const res = await keeper.post('/api/orders', { supplierId: supplier.id, lines: [{ partId: nut.id, packs: 4 }, { partId: oil.id, packs: 3 }] })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ number: 'PO-0001', status: 'draft', total: 37, lineCount: 2, supplierEmail: 'orders@calder.example' })
    orderId = res.body.id
    const lines = res.body.lines as { id: number; partId: number }[]
    lineOf = (partId) => lines.find((l) => l.partId === partId)!.id
    expect((await keeper.get('/api/orders/suggestions')).body).toEqual([])
    expect((await supply(nut)).onOrder).toBe(100)
    expect(await openAlertKeys()).toHaveLength(2)
  })

  it('lets a storekeeper change the draft (5 packs of nuts) and refuses a builder', async () => {
    const res = await keeper.patch(`/api/orders/${orderId}`, { lines: [{ partId: nut.id, packs: 5 }, { partId: oil.id, packs: 3 }], notes: 'Deliver to the clubroom.' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ total: 39.5, notes: 'Deliver to the clubroom.' })
    const lines = res.body.lines as { id: number; partId: number }[]
    lineOf = (partId) => lines.find((l) => l.partId === partId)!.id
    const builder = await clientAs(t.app, 'builder')
    expect((await builder.patch(`/api/orders/${orderId}`, { notes: 'x' })).status).toBe(403)
  })

  it('sends the order: the supplier gets the text and a PDF, the order is sent with an expected date', async () => {
    const res = await keeper.post(`/api/orders/${orderId}/send`)
    expect(res.status).toBe(200)
    const expected = todayIso(new Date(Date.now() + 4 * 86_400_000))
    expect(res.body).toMatchObject({ status: 'sent', expectedOn: expected })
    expect(res.body.emails).toEqual([expect.objectContaining({ to: 'orders@calder.example', status: 'sent', tries: 1 })])
    await sink.waitFor(1)
    expect(sink.messages[0].to).toEqual(['orders@calder.example'])
    const mail = parseMail(sink.messages[0].raw)
    expect(mail.subject).toBe('Purchase order PO-0001 from Test bench workshop')
    expect(mail.text).toContain(`[CF-${nut.id}] 6BA full nut, brass (our code ${nut.code}): 5 pack(s) of 25 pcs at 2.50 a pack = 12.50`)
    expect(mail.text).toContain('Total: 39.50')
    expect(mail.attachments).toHaveLength(1)
    const pdf = mail.attachments[0]
    expect(pdf).toMatchObject({ filename: 'PO-0001.pdf', contentType: 'application/pdf' })
    expect(pdf.content.subarray(0, 5).toString()).toBe('%PDF-')
    const text = mupdf.Document.openDocument(pdf.content, 'application/pdf').loadPage(0).toStructuredText('preserve-whitespace').asText()
    expect(text).toContain('Purchase order PO-0001')
    expect(text).toContain('6BA full nut, brass')
    expect(text).toContain('39.50')
    expect(await supply(nut)).toMatchObject({ onHand: 40, onOrder: 125 })
    expect(await openAlertKeys()).toEqual([`low-stock:${nut.id}`, `low-stock:${oil.id}`].sort())
    expect((await keeper.post(`/api/orders/${orderId}/send`)).body.error.code).toBe('ORDER_STATUS')
    expect((await keeper.patch(`/api/orders/${orderId}`, { notes: 'late change' })).status).toBe(409)
  })

  it('receives 100 of the 125 nuts: part-received, stock up, the nut alert cleared, unit cost averaged', async () => {
    const res = await keeper.post(`/api/orders/${orderId}/receive`, { lines: [{ lineId: lineOf(nut.id), binId: bins[0].id, quantity: 100 }] })
    expect(res.status).toBe(200)
    expect(res.body.status).toBe('part-received')
    expect(res.body.lines.find((l: { partId: number }) => l.partId === nut.id)).toMatchObject({ receivedQuantity: 100, remaining: 25 })
    const s = await supply(nut)
    expect(s).toMatchObject({ onHand: 140, available: 140, onOrder: 25 })
    // Weighted average: (40 × 0.08 + 100 × 0.10) ÷ 140 = 13.2 ÷ 140 = 0.0942857…
    expect(s.unitCost).toBeCloseTo(13.2 / 140, 9)
    expect(await openAlertKeys()).toEqual([`low-stock:${oil.id}`])
    const moves = await t.dataSource.getRepository(Movement).findBy({ purchaseOrderId: orderId })
    expect(moves.map((m) => [m.kind, m.partId, m.quantity, m.toBinId])).toEqual([['receive', nut.id, 100, bins[0].id]])
  })

  it('refuses 30 more nuts (5 over) without confirmation and changes nothing, then takes them when confirmed', async () => {
    const body = { lines: [{ lineId: lineOf(nut.id), binId: bins[2].id, quantity: 30 }] }
    const refused = await keeper.post(`/api/orders/${orderId}/receive`, body)
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('OVER_RECEIPT')
    expect(refused.body.error.details).toEqual([expect.objectContaining({ ordered: 125, alreadyReceived: 100, receiving: 30, over: 5 })])
    expect((await supply(nut)).onHand).toBe(140)
    const confirmed = await keeper.post(`/api/orders/${orderId}/receive`, { ...body, confirmOverReceipt: true })
    expect(confirmed.status).toBe(200)
    expect(confirmed.body.status).toBe('part-received')
    expect(await supply(nut)).toMatchObject({ onHand: 170, onOrder: 0 })
  })

  it('asks for the expiry of the oil batch, then receives it: the order is received and no alert is left', async () => {
    const line = { lineId: lineOf(oil.id), binId: bins[1].id, quantity: 3 }
    const noExpiry = await keeper.post(`/api/orders/${orderId}/receive`, { lines: [line] })
    expect(noExpiry.status).toBe(400)
    expect(noExpiry.body.error.code).toBe('EXPIRY_REQUIRED')
    expect((await supply(oil)).onHand).toBe(2)
    const res = await keeper.post(`/api/orders/${orderId}/receive`, { lines: [{ ...line, batchCode: 'SC-31', expiresOn: '2032-06-30' }] })
    expect(res.status).toBe(200)
    expect(res.body.status).toBe('received')
    expect(await supply(oil)).toMatchObject({ onHand: 5, available: 5, onOrder: 0 })
    expect(await openAlertKeys()).toEqual([])
    expect((await keeper.post(`/api/orders/${orderId}/receive`, { lines: [line] })).body.error.code).toBe('ORDER_STATUS')
  })

  it('closes the received order; a received order cannot be cancelled', async () => {
    expect((await keeper.post(`/api/orders/${orderId}/cancel`)).status).toBe(409)
    const res = await keeper.post(`/api/orders/${orderId}/close`)
    expect(res.body.status).toBe('closed')
    const list = (await keeper.get('/api/orders?status=closed')).body
    expect(list.items.map((o: { number: string }) => o.number)).toEqual(['PO-0001'])
  })
})

describe('order edge cases', () => {
  it('numbers the next order PO-0002, cancels a draft, and refuses a supplier without e-mail at send', async () => {
    const quiet = await keeper.post('/api/suppliers', { name: 'No-mail Metals (invented)', leadTimeDays: 10 })
    const res = await keeper.post('/api/orders', { supplierId: quiet.body.id, lines: [{ partId: nut.id, packs: 1, packSize: 10, packPrice: 1.2 }] })
    expect(res.body).toMatchObject({ number: 'PO-0002', total: 1.2 })
    const send = await keeper.post(`/api/orders/${res.body.id}/send`)
    expect(send.status).toBe(409)
    expect(send.body.error.code).toBe('SUPPLIER_NO_EMAIL')
    expect((await keeper.post(`/api/orders/${res.body.id}/cancel`)).body.status).toBe('cancelled')
  })

  it('refuses bad input with 400 and the error shape', async () => {
    const res = await keeper.post('/api/orders', { supplierId: supplier.id, lines: [{ partId: nut.id, packs: 0 }] })
    expect(res.status).toBe(400)
    expect(res.body.error).toMatchObject({ code: 'INVALID_INPUT' })
    const twice = await keeper.post('/api/orders', { supplierId: supplier.id, lines: [{ partId: nut.id, packs: 1 }, { partId: nut.id, packs: 2 }] })
    expect(twice.status).toBe(400)
  })
})
