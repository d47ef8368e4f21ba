import type { Config } from '../config'
import { refreshAllAlerts, track, watchStockForAlerts } from './alerts'
import { sendDigest } from './digest'
import { configureMail, deliverQueued, stopRetries, useLocalSink } from './mail'
import { startMailSink, type MailSink } from './mail-sink'
import { setNotifyConfig } from './notify-config'

/** Expiry dates move on by themselves and builds change status: look at every part this often. */
const SWEEP_INTERVAL_MS = 60 * 60 * 1000

/** Alerts follow stock changes; mail goes out through the configured SMTP server (app and tests). */
export function startNotifications(config: Config) {
  setNotifyConfig(config)
  configureMail(config)
  watchStockForAlerts()
}

/**
 * `npm start` / `npm run dev` without SMTP_HOST: start the local fake SMTP server and point
 * the config at it, so e-mail is sent for real but never leaves the machine.
 */
export async function startLocalMailSinkIfNeeded(config: Config): Promise<MailSink | undefined> {
  if (config.SMTP_HOST) return undefined
  const sink = await startMailSink()
  useLocalSink(sink)
  config.SMTP_HOST = sink.host
  config.SMTP_PORT = sink.port
  return sink
}

/** Milliseconds from `now` to the next `hour`:00 local time. */
export function msUntilHour(hour: number, now = new Date()): number {
  const next = new Date(now)
  next.setHours(hour, 0, 0, 0)
  if (next.getTime() <= now.getTime()) next.setDate(next.getDate() + 1)
  return next.getTime() - now.getTime()
}

async function dailyDigest() {
  await refreshAllAlerts()
  const result = await sendDigest()
  console.log(result.sent ? `Alert digest: ${result.alertCount} alert(s) to ${result.recipients.join(', ')} (${result.status})` : `Alert digest: ${result.reason}`)
}

/**
 * The running server's timers (never started in tests): a first full alert sweep, delivery of
 * mail left queued by a restart, an hourly sweep and the daily digest at DIGEST_HOUR.
 * Returns a function that stops them.
 */
export function startSchedules(config: Config): () => void {
  void track(refreshAllAlerts())
  void deliverQueued().catch((err) => console.error('mail: delivering queued messages failed', err))
  const sweep = setInterval(() => void track(refreshAllAlerts()), SWEEP_INTERVAL_MS)
  sweep.unref()
  let daily: NodeJS.Timeout
  const planDigest = () => {
    daily = setTimeout(() => {
      void dailyDigest().catch((err) => console.error('Alert digest failed:', err instanceof Error ? err.message : err))
        .finally(planDigest)
    }, msUntilHour(config.DIGEST_HOUR))
    daily.unref()
  }
  planDigest()
  return () => {
    clearInterval(sweep)
    clearTimeout(daily)
    stopRetries()
  }
}
