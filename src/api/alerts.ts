import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { AlertDto, DigestResultDto } from '../../shared/types/alert'
import type { AlertKind } from '../../shared/types/domain'

export type { AlertDto, DigestResultDto }

export const alertsApi = {
  list: (p: { open?: boolean; kind?: AlertKind; page?: number; pageSize?: number } = {}) =>
    request<Page<AlertDto>>('GET', `/alerts${query(p)}`),
  digest: () => request<DigestResultDto>('POST', '/alerts/digest'),
}
