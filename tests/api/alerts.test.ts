import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { clientAs, clientFor, createTestApp, demoUser, type Client } from '../helpers/app'
import { parseMail } from '../helpers/mail'
import { smallStore, stockedPart } from '../helpers/stores'
import { startMailSink, type MailSink } from '../../server/services/mail-sink'
import { settle } from '../../server/services/alerts'
import { Alert, OutboxMessage, User, type Bin, type Part } from '../../server/entities'

const PUBLIC_URL = 'http://stores.test'
let t: Awaited<ReturnType<typeof createTestApp>>
let sink: MailSink
let keeper: Client
let builder: Client
let part: Part
let bin: Bin

beforeAll(async () => {
  sink = await startMailSink()
  t = await createTestApp({ config: { SMTP_HOST: sink.host, SMTP_PORT: sink.port, PUBLIC_URL } })
  const keeperUser = await t.dataSource.getRepository(User).findOneByOrFail({ username: demoUser('storekeeper').username })
  const store = await smallStore(keeperUser.id)
  bin = store.bins[0]
  // 50 nuts, reorder at 40, reorder quantity 100, sold in packs of 25.
  part = await stockedPart({
    name: '6BA full nut, brass', attributes: { kind: 'fastener', type: 'nut', thread: '6BA', material: 'brass' },
    reorderPoint: 40, reorderQuantity: 100, unitCost: 0.08,
  }, { supplierId: store.supplier.id, binId: bin.id, quantity: 50, packSize: 25, packPrice: 2, userId: keeperUser.id })
  await settle()
  keeper = await clientAs(t.app, 'storekeeper')
  builder = await clientAs(t.app, 'builder')
})
afterAll(async () => {
  await t.close()
  await sink.close()
})

const openAlerts = async () => (await keeper.get('/api/alerts')).body.items as { id: number; kind: string; partId: number; emailedAt: string | null }[]
const take = (quantity: number) => builder.post('/api/stock/take', { partId: part.id, binId: bin.id, quantity, reason: 'test bench' })

describe('low-stock alerts and the digest e-mail', () => {
  it('raises nothing while available stock is above the reorder point', async () => {
    expect(await openAlerts()).toEqual([])
  })

  it('raises exactly one low-stock alert when a draw takes the part to its reorder point', async () => {
    const res = await take(10)
    expect(res.status).toBe(200)
    const alerts = await openAlerts()
    expect(alerts).toHaveLength(1)
    expect(alerts[0]).toMatchObject({ kind: 'low-stock', partId: part.id, emailedAt: null })
    expect(await t.dataSource.getRepository(Alert).countBy({ key: `low-stock:${part.id}` })).toBe(1)
  })

  it('e-mails the storekeepers exactly one digest listing the part with its quantities and links', async () => {
    const res = await keeper.post('/api/alerts/digest')
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ sent: true, alertCount: 1, status: 'sent', recipients: [demoUser('storekeeper').email] })
    await sink.waitFor(1)
    expect(sink.messages).toHaveLength(1)
    expect(sink.messages[0].to).toEqual([demoUser('storekeeper').email])
    const mail = parseMail(sink.messages[0].raw)
    expect(mail.subject).toBe('Stores alert: 1 low')
    // 50 − 10 = 40 available, equal to the reorder point; order 100 = 4 packs of 25.
    expect(mail.text).toContain(`${part.code} 6BA full nut, brass: 40 pcs available (on hand 40, reserved 0), reorder point 40; suggested order 100 pcs (4 × 25)`)
    expect(mail.text).toContain(`${PUBLIC_URL}/parts/${part.id}`)
    expect(mail.text).toContain(`${PUBLIC_URL}/orders?suggest=1`)
    expect(mail.html).toContain(`href="${PUBLIC_URL}/orders?suggest=1"`)
    const stored = await t.dataSource.getRepository(OutboxMessage).findOneByOrFail({ id: res.body.outboxId })
    expect(stored).toMatchObject({ status: 'sent', tries: 1, lastError: null })
    expect((await openAlerts())[0].emailedAt).not.toBeNull()
  })

  it('sends no second e-mail when a second draw finds the same alert still open', async () => {
    expect((await take(5)).status).toBe(200)
    const alerts = await openAlerts()
    expect(alerts).toHaveLength(1)
    const res = await keeper.post('/api/alerts/digest')
    expect(res.body).toMatchObject({ sent: false, alertCount: 0, outboxId: null })
    expect(res.body.reason).toMatch(/No new alerts/)
    await new Promise((r) => setTimeout(r, 200))
    expect(sink.messages).toHaveLength(1)
  })

  it('clears the alert when stock is received above the reorder point', async () => {
    const res = await keeper.post('/api/stock/receive', { partId: part.id, binId: bin.id, quantity: 25, reason: 'a pack came' })
    expect(res.status).toBe(201)
    expect(await openAlerts()).toEqual([])
    const all = (await keeper.get('/api/alerts?open=false')).body.items
    expect(all).toHaveLength(1)
    expect(all[0].resolvedAt).not.toBeNull()
  })

  it('raises a fresh alert (and a fresh e-mail) if the part falls to its reorder point again', async () => {
    expect((await take(20)).status).toBe(200)
    const alerts = await openAlerts()
    expect(alerts).toHaveLength(1)
    expect((await keeper.post('/api/alerts/digest')).body).toMatchObject({ sent: true, alertCount: 1 })
    await sink.waitFor(2)
    expect(parseMail(sink.messages[1].raw).text).toContain('40 pcs available (on hand 40, reserved 0)')
  })

  it('refuses the digest to a builder (403) and to a signed-out caller (401)', async () => {
    expect((await builder.post('/api/alerts/digest')).status).toBe(403)
    const anonymous = await clientFor(t.app)
    expect((await anonymous.post('/api/alerts/digest')).status).toBe(401)
  })
})

describe('shortage and expiry alerts', () => {
  it('opens a shortage alert when a build cannot reserve all it needs, and clears it once reserved', async () => {
    const user = await t.dataSource.getRepository(User).findOneByOrFail({ username: demoUser('storekeeper').username })
    const supplierId = (await keeper.get('/api/suppliers')).body.items[0].id
    const studs = await stockedPart({
      name: '5BA stud 25 mm, mild steel', attributes: { kind: 'fastener', type: 'stud', thread: '5BA', lengthMm: 25, material: 'mild steel' },
    }, { supplierId, binId: bin.id, quantity: 20, packSize: 10, packPrice: 1.2, userId: user.id })
    const build = (await builder.post('/api/builds', { name: 'Stuart 10V (test)' })).body
    const line = (await builder.post(`/api/builds/${build.id}/lines`, { partId: studs.id, quantity: 30 })).body
    const lineId = line.id ?? line.lines?.find((l: { partId: number }) => l.partId === studs.id)?.id
    expect((await builder.post(`/api/builds/${build.id}/reserve`, { allowPartial: true })).status).toBe(200)
    const open = (await keeper.get('/api/alerts?kind=shortage')).body.items
    expect(open).toHaveLength(1)
    expect(open[0]).toMatchObject({ key: `shortage:${lineId}`, partId: studs.id, buildId: build.id })
    expect(open[0].message).toBe(`Stuart 10V (test) is short of 10 pcs of ${studs.code} 5BA stud 25 mm, mild steel`)
    expect((await keeper.post('/api/stock/receive', { partId: studs.id, binId: bin.id, quantity: 10, reason: 'a pack came' })).status).toBe(201)
    expect((await builder.post(`/api/builds/${build.id}/reserve`, { allowPartial: true })).status).toBe(200)
    expect((await keeper.get('/api/alerts?kind=shortage')).body.items).toEqual([])
  })

  it('opens an expiring alert for a batch within the warning window and lists it in the next digest', async () => {
    const user = await t.dataSource.getRepository(User).findOneByOrFail({ username: demoUser('storekeeper').username })
    const supplierId = (await keeper.get('/api/suppliers')).body.items[0].id
    const soon = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10)
    const glue = await stockedPart({
      name: 'Retaining compound, 10 ml', unit: 'bottle', attributes: { kind: 'compound', grade: 'high-strength retaining compound', containerSize: '10 ml' },
    }, { supplierId, binId: bin.id, quantity: 1, packSize: 1, packPrice: 7, userId: user.id, expiresOn: soon })
    await settle()
    const alerts = (await keeper.get('/api/alerts?kind=expiring')).body.items
    expect(alerts).toHaveLength(1)
    expect(alerts[0]).toMatchObject({ partId: glue.id })
    const before = sink.messages.length
    expect((await keeper.post('/api/alerts/digest')).body).toMatchObject({ sent: true })
    await sink.waitFor(before + 1)
    const mail = parseMail(sink.messages[before].raw)
    expect(mail.text).toContain('Batches expiring soon:')
    expect(mail.text).toContain(`- ${glue.code} Retaining compound, 10 ml: batch ${soon} in T1-01 (1 bottle): expires on ${soon}`)
  })
})

