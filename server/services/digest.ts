import { In, IsNull, Not } from 'typeorm'
import { db, inTransaction } from '../db'
import { Alert, Part, User } from '../entities'
import { conflict } from '../errors'
import { settle } from './alerts'
import { deliver, queueMail } from './mail'
import { notifyConfig } from './notify-config'
import { stockTotals } from './stock-totals'
import { suggestionLines } from './order-suggestions'
import { composeDigest, type DigestLine } from './digest-mail'
import type { DigestResultDto } from '../../shared/types/alert'

/** ALERT_RECIPIENTS, or every active storekeeper with an e-mail address. */
export async function digestRecipients(): Promise<string[]> {
  const configured = notifyConfig().ALERT_RECIPIENTS
  if (configured) return configured.split(',').map((s) => s.trim()).filter(Boolean)
  const keepers = await db().manager.findBy(User, { role: 'storekeeper', active: true, email: Not(IsNull()) })
  return keepers.map((u) => u.email!).filter(Boolean)
}

const nothing = (reason: string, recipients: string[] = []): DigestResultDto =>
  ({ sent: false, alertCount: 0, recipients, outboxId: null, status: null, reason })

/**
 * E-mails the open alerts that no e-mail has listed yet, then marks them e-mailed, so an alert
 * that stays open is never sent twice. The message goes through the outbox (retried on failure).
 */
export async function sendDigest(now = new Date()): Promise<DigestResultDto> {
  await settle()
  const recipients = await digestRecipients()
  const queued = await inTransaction(async (tx) => {
    const alerts = await tx.find(Alert, { where: { resolvedAt: IsNull(), emailedAt: IsNull() }, order: { id: 'ASC' } })
    if (!alerts.length) return null
    if (!recipients.length) {
      throw conflict('NO_RECIPIENTS', 'Nobody to send the digest to: give a storekeeper an e-mail address or set ALERT_RECIPIENTS.')
    }
    const partIds = [...new Set(alerts.map((a) => a.partId!).filter(Boolean))]
    const parts = new Map((await tx.findBy(Part, { id: In(partIds) })).map((p) => [p.id, p]))
    const totals = await stockTotals(partIds, tx)
    const suggestions = new Map((await suggestionLines(partIds, tx)).map((s) => [s.partId, s]))
    // A part both low and short for a build carries its suggested order once, on the low-stock line.
    const lowIds = new Set(alerts.filter((a) => a.kind === 'low-stock').map((a) => a.partId))
    const lines: DigestLine[] = alerts.map((alert) => {
      const p = parts.get(alert.partId ?? 0)
      const t = totals.get(alert.partId ?? 0)
      const stockLike = alert.kind === 'low-stock' || (alert.kind === 'shortage' && !lowIds.has(alert.partId))
      return {
        alert, partCode: p?.code ?? '', partName: p?.name ?? '', unit: p?.unit ?? '',
        stock: t && p ? { ...t, reorderPoint: p.reorderPoint } : undefined,
        suggestion: stockLike ? suggestions.get(alert.partId ?? 0) : undefined,
      }
    })
    const stillOpen = await tx.countBy(Alert, { resolvedAt: IsNull(), emailedAt: Not(IsNull()) })
    const mail = composeDigest(lines, stillOpen, notifyConfig().publicUrl)
    const msg = await queueMail(tx, { to: recipients, ...mail })
    await tx.update(Alert, { id: In(alerts.map((a) => a.id)) }, { emailedAt: now.toISOString() })
    return { id: msg.id, count: alerts.length }
  })
  if (!queued) return nothing('No new alerts since the last digest: nothing to send.', recipients)
  const after = await deliver(queued.id)
  return {
    sent: true, alertCount: queued.count, recipients, outboxId: queued.id,
    status: (after?.status ?? 'queued') as DigestResultDto['status'], reason: null,
  }
}
