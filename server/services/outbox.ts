import { db } from '../db'
import { OutboxMessage } from '../entities'
import { notFound } from '../errors'
import { mailStatus, requeue } from './mail'
import type { Page } from '../../shared/types/api'
import type { MailStatusDto, OutboxDetailDto, OutboxMessageDto } from '../../shared/types/outbox'

const toDto = (m: OutboxMessage): OutboxMessageDto => ({
  id: m.id, to: m.to, subject: m.subject, status: m.status as OutboxMessageDto['status'], tries: m.tries,
  lastError: m.lastError, createdAt: new Date(m.createdAt).toISOString(), sentAt: m.sentAt,
  attachments: m.attachments.map((a, index) => ({
    index, filename: a.filename, contentType: a.contentType, bytes: Math.floor((a.base64.length * 3) / 4),
  })),
})

export async function listOutbox(status: string | undefined, page: number, pageSize: number): Promise<Page<OutboxMessageDto>> {
  const [rows, total] = await db().manager.findAndCount(OutboxMessage, {
    where: status ? { status } : {}, order: { id: 'DESC' }, skip: (page - 1) * pageSize, take: pageSize,
  })
  return { items: rows.map(toDto), total, page, pageSize }
}

async function messageOrFail(id: number) {
  const m = await db().manager.findOneBy(OutboxMessage, { id })
  if (!m) throw notFound('The message')
  return m
}

export async function outboxMessage(id: number): Promise<OutboxDetailDto> {
  const m = await messageOrFail(id)
  return { ...toDto(m), text: m.text, html: m.html }
}

export async function outboxAttachment(id: number, index: number) {
  const a = (await messageOrFail(id)).attachments[index]
  if (!a) throw notFound('The attachment')
  return { filename: a.filename, contentType: a.contentType, content: Buffer.from(a.base64, 'base64') }
}

export async function retryMessage(id: number): Promise<OutboxDetailDto> {
  await messageOrFail(id)
  await requeue([id])
  return outboxMessage(id)
}

export async function outboxStatus(): Promise<MailStatusDto> {
  const rows: { status: string; n: number }[] = await db().manager.createQueryBuilder(OutboxMessage, 'm')
    .select('m.status', 'status').addSelect('COUNT(*)', 'n').groupBy('m.status').getRawMany()
  const count = (s: string) => Number(rows.find((r) => r.status === s)?.n ?? 0)
  return { ...mailStatus(), counts: { queued: count('queued'), sent: count('sent'), failed: count('failed') } }
}
