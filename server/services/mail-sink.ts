import { SMTPServer } from 'smtp-server'
import type { AddressInfo } from 'node:net'

/** A message as the local mail server received it. */
export interface CapturedMail {
  from: string
  to: string[]
  raw: string
  receivedAt: Date
}

export interface MailSink {
  host: string
  port: number
  messages: CapturedMail[]
  /** Resolves once `count` messages have arrived (or rejects after `timeoutMs`). */
  waitFor: (count: number, timeoutMs?: number) => Promise<CapturedMail[]>
  close: () => Promise<void>
}

/** Messages kept in memory: enough to look at, small enough never to matter. */
const KEEP_MESSAGES = 500
const LOOPBACK = '127.0.0.1'

/**
 * A fake SMTP server on 127.0.0.1 and a free port that accepts every message and keeps it, so
 * development and tests send real SMTP without anything leaving the machine. STARTTLS is off
 * (no certificate), so senders talk plain SMTP to it.
 */
export async function startMailSink(): Promise<MailSink> {
  const messages: CapturedMail[] = []
  const waiters: (() => void)[] = []
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (c: Buffer) => chunks.push(c))
      stream.on('end', () => {
        messages.push({
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          raw: Buffer.concat(chunks).toString('utf8'),
          receivedAt: new Date(),
        })
        if (messages.length > KEEP_MESSAGES) messages.shift()
        waiters.splice(0).forEach((w) => w())
        callback()
      })
    },
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(0, LOOPBACK, () => resolve())
  })
  const port = (server.server.address() as AddressInfo).port
  const waitFor = (count: number, timeoutMs = 10_000) => new Promise<CapturedMail[]>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`only ${messages.length} of ${count} message(s) arrived`)), timeoutMs)
    const check = () => {
      if (messages.length >= count) { clearTimeout(timer); resolve(messages) } else waiters.push(check)
    }
    check()
  })
  return {
    host: LOOPBACK, port, messages, waitFor,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  }
}
