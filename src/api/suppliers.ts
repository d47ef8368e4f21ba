import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type {
  PartSupplyDto, ReorderSuggestionDto, SupplierDetailDto, SupplierDto, SupplierOfferDto,
} from '../../shared/types/supplier'
import type {
  OfferInput, OfferPatch, ReorderRulesInput, SuggestionQuery, SupplierInput, SupplierPatch,
} from '../../shared/schemas/supplier'

export type { PartSupplyDto, ReorderSuggestionDto, SupplierDetailDto, SupplierDto, SupplierOfferDto }

export const suppliersApi = {
  list: (p: { q?: string; page?: number; pageSize?: number } = {}) =>
    request<Page<SupplierDto>>('GET', `/suppliers${query(p)}`),
  get: (id: number) => request<SupplierDetailDto>('GET', `/suppliers/${id}`),
  create: (input: SupplierInput) => request<SupplierDetailDto>('POST', '/suppliers', input),
  update: (id: number, input: SupplierPatch) => request<SupplierDetailDto>('PATCH', `/suppliers/${id}`, input),
  remove: (id: number) => request<void>('DELETE', `/suppliers/${id}`),
  addOffer: (id: number, input: OfferInput) => request<SupplierOfferDto>('POST', `/suppliers/${id}/offers`, input),
  updateOffer: (id: number, offerId: number, input: OfferPatch) =>
    request<SupplierOfferDto>('PATCH', `/suppliers/${id}/offers/${offerId}`, input),
  removeOffer: (id: number, offerId: number) => request<void>('DELETE', `/suppliers/${id}/offers/${offerId}`),
}

/** A part's supply side: suppliers, reorder rules and the suggestion from its ledger. */
export const supplyApi = {
  get: (partId: number) => request<PartSupplyDto>('GET', `/parts/${partId}/supply`),
  suggestion: (partId: number, q: SuggestionQuery = {}) =>
    request<ReorderSuggestionDto>('GET', `/parts/${partId}/reorder-suggestion${query({ ...q })}`),
  setRules: (partId: number, input: ReorderRulesInput) => request<PartSupplyDto>('PATCH', `/parts/${partId}/reorder`, input),
}
