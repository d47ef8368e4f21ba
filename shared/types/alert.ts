import type { AlertKind } from './domain'

/** Something that needs a storekeeper's attention; raised once, cleared when resolved. */
export interface AlertDto {
  id: number
  kind: AlertKind
  key: string
  partId: number | null
  partCode: string
  partName: string
  unit: string
  lotId: number | null
  buildId: number | null
  message: string
  openedAt: string
  resolvedAt: string | null
  emailedAt: string | null
}

/** What POST /api/alerts/digest did. */
export interface DigestResultDto {
  sent: boolean
  /** New alerts the e-mail lists (0 when nothing was sent). */
  alertCount: number
  recipients: string[]
  outboxId: number | null
  /** Delivery state after the first try: sent, or queued for a retry, or failed. */
  status: 'queued' | 'sent' | 'failed' | null
  /** Why nothing was sent, when nothing was. */
  reason: string | null
}
