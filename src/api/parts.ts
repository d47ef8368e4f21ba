import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type { PartKind } from '../../shared/types/domain'
import type {
  CsvImportResult, PartDetailDto, PartSearchPage, PartSummaryDto,
} from '../../shared/types/part'
import type { PartInput } from '../../shared/schemas/part'

export type { CsvImportResult, PartDetailDto, PartSearchPage, PartSummaryDto }

export interface PartListParams {
  q?: string
  kind?: PartKind
  page?: number
  pageSize?: number
  includeArchived?: boolean
}

export const partsApi = {
  /** Search the catalogue the way the trade types (`7ba nut`, `brass hex 1/4`); paginated. */
  list: (p: PartListParams = {}) => request<PartSearchPage>('GET', `/parts${query({ ...p })}`),
  get: (id: number) => request<PartDetailDto>('GET', `/parts/${id}`),
  byLabel: (labelCode: string) => request<PartDetailDto>('GET', `/parts/by-label/${encodeURIComponent(labelCode)}`),
  create: (input: PartInput) => request<PartDetailDto>('POST', '/parts', input),
  update: (id: number, input: PartInput) => request<PartDetailDto>('PATCH', `/parts/${id}`, input),
  archive: (id: number) => request<PartDetailDto>('POST', `/parts/${id}/archive`),
  restore: (id: number) => request<PartDetailDto>('POST', `/parts/${id}/restore`),
  suggestCode: (input: Pick<PartInput, 'name' | 'attributes'> & { exceptId?: number }) =>
    request<{ code: string }>('POST', '/parts/suggest-code', input),
  remove: (id: number) => request<void>('DELETE', `/parts/${id}`),
  /** A CSV file goes as text/csv (a whole catalogue can pass the 1 MB JSON limit). */
  importCsv: (file: Blob, dryRun: boolean) =>
    request<CsvImportResult>('POST', `/parts/import${query({ dryRun })}`, new Blob([file], { type: 'text/csv' })),
  importStockLevels: (file: Blob, dryRun: boolean) =>
    request<CsvImportResult>('POST', `/stock-levels/import${query({ dryRun })}`, new Blob([file], { type: 'text/csv' })),
  /** Plain links: the browser downloads the CSV with the session cookie. */
  exportUrl: '/api/parts/export.csv',
  stockLevelsExportUrl: '/api/stock-levels/export.csv',
}

export type PartPage = Page<PartSummaryDto>
