import { query, request } from './http'
import type { ScanResultDto } from '../../shared/types/labels'
import type { DrawLineDto, StockTakeResultDto } from '../../shared/types/bin-page'
import type { StockTakeInput } from '../../shared/schemas/stocktake'

export const scanApi = {
  /** Where a scanned or typed code leads; 404 NOT_OUR_LABEL for anything else. */
  resolve: (code: string) => request<ScanResultDto>('GET', `/scan/resolve${query({ code })}`),
  /** Open build lines the signed-in user may draw from a bin, reserved first. */
  drawLines: (binId: number) => request<DrawLineDto[]>('GET', `/scan/bins/${binId}/draw-lines`),
  /** A stock-take over many bins, applied together (storekeepers). */
  applyStockTake: (input: StockTakeInput) => request<StockTakeResultDto>('POST', '/stocktake/apply', input),
}
