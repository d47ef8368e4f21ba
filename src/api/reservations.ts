import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { ReservationDto } from '../../shared/types/build'

export type { ReservationDto }

export const reservationsApi = {
  /** Which builds hold this part. */
  forPart: (partId: number, page = 1) =>
    request<Page<ReservationDto>>('GET', `/reservations${query({ partId, page })}`),
}
