import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createServer } from 'node:net'
import { clientAs, createTestApp, demoUser, type Client } from '../helpers/app'
import { smallStore, stockedPart } from '../helpers/stores'
import { startMailSink, type MailSink } from '../../server/services/mail-sink'
import { configureMail, MAX_TRIES, setRetryDelays, stopRetries } from '../../server/services/mail'
import { settle } from '../../server/services/alerts'
import { User } from '../../server/entities'

/** A port nothing listens on: bind a free one, then let it go. */
async function closedPort(): Promise<number> {
  const s = createServer()
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', () => r()))
  const port = (s.address() as { port: number }).port
  await new Promise<void>((r) => s.close(() => r()))
  return port
}

let t: Awaited<ReturnType<typeof createTestApp>>
let sink: MailSink | undefined
let keeper: Client
let admin: Client

beforeAll(async () => {
  t = await createTestApp({ config: { SMTP_HOST: '127.0.0.1', SMTP_PORT: await closedPort() } })
  setRetryDelays([20, 20, 20, 20])
  const user = await t.dataSource.getRepository(User).findOneByOrFail({ username: demoUser('storekeeper').username })
  const store = await smallStore(user.id)
  await stockedPart({
    name: '8BA full nut, brass', attributes: { kind: 'fastener', type: 'nut', thread: '8BA', material: 'brass' },
    reorderPoint: 10, reorderQuantity: 50,
  }, { supplierId: store.supplier.id, binId: store.bins[0].id, quantity: 5, packSize: 50, packPrice: 3, userId: user.id })
  await settle()
  keeper = await clientAs(t.app, 'storekeeper')
  admin = await clientAs(t.app, 'admin')
})
afterAll(async () => {
  stopRetries()
  await t.close()
  await sink?.close()
})

async function until<T>(read: () => Promise<T>, ok: (v: T) => boolean, ms = 5000): Promise<T> {
  const end = Date.now() + ms
  for (;;) {
    const v = await read()
    if (ok(v) || Date.now() > end) return v
    await new Promise((r) => setTimeout(r, 25))
  }
}

describe('the outbox when the mail server is down', () => {
  let id: number
  it('keeps the digest queued with the error after the first failed try', async () => {
    const res = await keeper.post('/api/alerts/digest')
    expect(res.body).toMatchObject({ sent: true, alertCount: 1, status: 'queued' })
    id = res.body.outboxId
    const msg = (await admin.get(`/api/outbox/${id}`)).body
    expect(msg.tries).toBeGreaterThanOrEqual(1)
    expect(msg.lastError).toMatch(/ECONNREFUSED|connect/i)
  })

  it(`retries with waits between tries and marks the message failed after ${MAX_TRIES} tries`, async () => {
    const msg = await until(async () => (await admin.get(`/api/outbox/${id}`)).body, (m) => m.status === 'failed')
    expect(msg).toMatchObject({ status: 'failed', tries: MAX_TRIES })
    const list = (await admin.get('/api/outbox?status=failed')).body
    expect(list.items.map((m: { id: number }) => m.id)).toEqual([id])
    expect((await admin.get('/api/outbox/status')).body).toMatchObject({ mode: 'smtp', counts: { queued: 0, sent: 0, failed: 1 } })
  })

  it('shows the outbox to admins only', async () => {
    expect((await keeper.get('/api/outbox')).status).toBe(403)
  })

  it('sends the failed message when an admin retries once the mail server is back', async () => {
    sink = await startMailSink()
    configureMail({ ...t.config, SMTP_HOST: sink.host, SMTP_PORT: sink.port })
    const res = await admin.post(`/api/outbox/${id}/retry`)
    expect(res.body).toMatchObject({ status: 'sent', tries: 1, lastError: null })
    await sink.waitFor(1)
    expect(sink.messages[0].to).toEqual([demoUser('storekeeper').email])
  })
})
