import nodemailer, { type Transporter } from 'nodemailer'
import { In, type EntityManager } from 'typeorm'
import { db, inTransaction } from '../db'
import { OutboxMessage } from '../entities'
import type { Config } from '../config'

export type MailMode = 'smtp' | 'local-capture' | 'off'

export interface MailInput {
  to: string[]
  subject: string
  text: string
  html?: string
  attachments?: { filename: string; contentType: string; content: Buffer }[]
}

/** Tries per message, then it is marked failed (and shown on the Outbox page). */
export const MAX_TRIES = 5
/** Wait before try 2, 3, 4, 5: roughly ×4 each time, so a mail server down for an hour is ridden out. */
let retryDelaysMs = [30_000, 2 * 60_000, 10 * 60_000, 40 * 60_000]
/** A mail server that does not answer within these is treated as down for this try. */
const CONNECT_TIMEOUT_MS = 10_000
const SOCKET_TIMEOUT_MS = 30_000

let transport: Transporter | undefined
let mode: MailMode = 'off'
let from = ''
let target = ''
let localSink: { host: string; port: number } | undefined
const sending = new Set<number>()
const timers = new Set<NodeJS.Timeout>()

/** Tells the mail service that `npm start` runs the local fake SMTP server at this address. */
export const useLocalSink = (sink: { host: string; port: number }) => { localSink = sink }

/** Sets up the SMTP transport from the config (SMTP_HOST unset and no local sink: mail stays queued). */
export function configureMail(config: Config) {
  from = config.SMTP_FROM
  if (!config.SMTP_HOST) {
    transport = undefined
    mode = 'off'
    target = ''
    return
  }
  const local = !!localSink && localSink.host === config.SMTP_HOST && localSink.port === config.SMTP_PORT
  mode = local ? 'local-capture' : 'smtp'
  target = `${config.SMTP_HOST}:${config.SMTP_PORT}`
  transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    // Port 465 speaks TLS from the first byte; others upgrade with STARTTLS when offered.
    secure: config.SMTP_PORT === 465,
    ignoreTLS: local,
    auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASS ?? '' } : undefined,
    connectionTimeout: CONNECT_TIMEOUT_MS,
    greetingTimeout: CONNECT_TIMEOUT_MS,
    socketTimeout: SOCKET_TIMEOUT_MS,
  })
}

export const mailStatus = () => ({ mode, target, from })

/** Tests shorten the waits between tries. */
export const setRetryDelays = (delays: number[]) => { retryDelaysMs = delays }

/** Puts a message in the outbox inside the caller's transaction; deliver() sends it after commit. */
export async function queueMail(tx: EntityManager, input: MailInput): Promise<OutboxMessage> {
  return tx.save(OutboxMessage, tx.create(OutboxMessage, {
    to: input.to.join(', '),
    subject: input.subject,
    text: input.text,
    html: input.html ?? null,
    attachments: (input.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, base64: a.content.toString('base64') })),
    status: 'queued',
    tries: 0,
    lastError: null,
  }))
}

const update = (id: number, changes: Partial<OutboxMessage>) =>
  inTransaction((tx) => tx.update(OutboxMessage, { id }, changes))

/**
 * One delivery try of a queued message. On failure the error is kept and another try is
 * scheduled with a longer wait; after MAX_TRIES the message is marked failed.
 */
export async function deliver(id: number): Promise<OutboxMessage | null> {
  if (sending.has(id)) return db().manager.findOneBy(OutboxMessage, { id })
  sending.add(id)
  try {
    const msg = await db().manager.findOneBy(OutboxMessage, { id })
    if (!msg || msg.status !== 'queued') return msg
    if (!transport) {
      await update(id, { lastError: 'No SMTP server is set up (SMTP_HOST); the message waits here.' })
      return db().manager.findOneBy(OutboxMessage, { id })
    }
    try {
      await transport.sendMail({
        from, to: msg.to, subject: msg.subject, text: msg.text, html: msg.html ?? undefined,
        attachments: msg.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.base64, 'base64') })),
      })
      await update(id, { status: 'sent', tries: msg.tries + 1, sentAt: new Date().toISOString(), lastError: null })
    } catch (err) {
      const tries = msg.tries + 1
      const failed = tries >= MAX_TRIES
      await update(id, { tries, status: failed ? 'failed' : 'queued', lastError: describe(err) })
      if (!failed) schedule(id, retryDelaysMs[Math.min(tries - 1, retryDelaysMs.length - 1)])
    }
    return db().manager.findOneBy(OutboxMessage, { id })
  } finally {
    sending.delete(id)
  }
}

function schedule(id: number, delayMs: number) {
  const timer = setTimeout(() => {
    timers.delete(timer)
    void deliver(id).catch(() => undefined)
  }, delayMs)
  timer.unref()
  timers.add(timer)
}

const describe = (err: unknown) => (err instanceof Error ? err.message : String(err)).slice(0, 500)

/** Sends every queued message once (at start-up, after a restart cut retries short). */
export async function deliverQueued(): Promise<void> {
  const queued = await db().manager.find(OutboxMessage, { where: { status: 'queued' }, select: { id: true } })
  for (const m of queued) await deliver(m.id)
}

/** A failed message goes back in the queue for a fresh round of tries (admin's "retry"). */
export async function requeue(ids: number[]): Promise<void> {
  await inTransaction((tx) => tx.update(OutboxMessage, { id: In(ids), status: In(['failed', 'queued']) }, { status: 'queued', tries: 0 }))
  for (const id of ids) await deliver(id)
}

/** Stops pending retry timers (tests, shutdown). */
export function stopRetries() {
  for (const t of timers) clearTimeout(t)
  timers.clear()
}
