import { query, request } from './http'
import type { MovementDto, StockResultDto } from '../../shared/types/stock'
import type { Page } from '../../shared/types/api'
import type { MovementKind } from '../../shared/types/domain'

/** Ledger filters; ids for part/bin/user/build/order, ISO dates for from/to (both included). */
export interface MovementFilter {
  part?: number
  bin?: number
  user?: number
  kind?: MovementKind
  build?: number
  purchaseOrder?: number
  from?: string
  to?: string
  page?: number
  pageSize?: number
}

export const movementsApi = {
  list: (filter: MovementFilter = {}) => request<Page<MovementDto>>('GET', `/movements${query({ ...filter })}`),
  /** A plain link (the browser downloads it with the session cookie). */
  exportUrl: (filter: MovementFilter = {}) => {
    const rest = { ...filter, page: undefined, pageSize: undefined }
    return `/api/movements/export.csv${query(rest)}`
  },
  /** Who has written to the ledger (for the "who" filter). */
  people: () => request<{ id: number; displayName: string }[]>('GET', '/movements/people'),
  reverse: (id: number, reason = '') => request<StockResultDto>('POST', `/movements/${id}/reverse`, { reason }),
}
