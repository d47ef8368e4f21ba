import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { OrderDetailDto, OrderSummaryDto, SuggestionGroupDto, SuggestionLineDto } from '../../shared/types/order'
import type { OrderCreateInput, OrderListQuery, OrderPatchInput, OrderReceiveInput } from '../../shared/schemas/order'

export type { OrderDetailDto, OrderSummaryDto, SuggestionGroupDto, SuggestionLineDto }

export const ordersApi = {
  list: (q: OrderListQuery = {}) => request<Page<OrderSummaryDto>>('GET', `/orders${query({ ...q })}`),
  suggestions: () => request<SuggestionGroupDto[]>('GET', '/orders/suggestions'),
  get: (id: number) => request<OrderDetailDto>('GET', `/orders/${id}`),
  create: (input: OrderCreateInput) => request<OrderDetailDto>('POST', '/orders', input),
  update: (id: number, input: OrderPatchInput) => request<OrderDetailDto>('PATCH', `/orders/${id}`, input),
  send: (id: number) => request<OrderDetailDto>('POST', `/orders/${id}/send`),
  receive: (id: number, input: OrderReceiveInput) => request<OrderDetailDto>('POST', `/orders/${id}/receive`, input),
  cancel: (id: number) => request<OrderDetailDto>('POST', `/orders/${id}/cancel`),
  close: (id: number) => request<OrderDetailDto>('POST', `/orders/${id}/close`),
  /** The PDF as the supplier gets it; opened in a new tab (a GET, so no CSRF token needed). */
  pdfUrl: (id: number) => `/api/orders/${id}/pdf`,
}
