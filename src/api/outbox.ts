import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { MailStatusDto, OutboxDetailDto, OutboxMessageDto } from '../../shared/types/outbox'

export type { MailStatusDto, OutboxDetailDto, OutboxMessageDto }

export const outboxApi = {
  list: (p: { status?: 'queued' | 'sent' | 'failed'; page?: number; pageSize?: number } = {}) =>
    request<Page<OutboxMessageDto>>('GET', `/outbox${query(p)}`),
  status: () => request<MailStatusDto>('GET', '/outbox/status'),
  get: (id: number) => request<OutboxDetailDto>('GET', `/outbox/${id}`),
  retry: (id: number) => request<OutboxDetailDto>('POST', `/outbox/${id}/retry`),
  attachmentUrl: (id: number, index: number) => `/api/outbox/${id}/attachments/${index}`,
}
