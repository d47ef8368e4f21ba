/** An e-mail in the outbox: every message the app sends, with its delivery state. */
export interface OutboxMessageDto {
  id: number
  to: string
  subject: string
  status: 'queued' | 'sent' | 'failed'
  tries: number
  lastError: string | null
  createdAt: string
  sentAt: string | null
  attachments: { index: number; filename: string; contentType: string; bytes: number }[]
}

export interface OutboxDetailDto extends OutboxMessageDto {
  text: string
  html: string | null
}

/** Where mail goes: a real SMTP server, the local test server, or nowhere yet. */
export interface MailStatusDto {
  mode: 'smtp' | 'local-capture' | 'off'
  target: string
  from: string
  counts: { queued: number; sent: number; failed: number }
}
