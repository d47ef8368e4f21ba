import { request } from './http'
import type { StockResultDto } from '../../shared/types/stock'
import type {
  AdjustInput, CountInput, MoveInput, ReceiveInput, ReturnInput, TakeInput,
} from '../../shared/schemas/stock'

/** Stock changes; each answers with the ledger rows it wrote. */
export const stockApi = {
  receive: (input: ReceiveInput) => request<StockResultDto>('POST', '/stock/receive', input),
  take: (input: TakeInput) => request<StockResultDto>('POST', '/stock/take', input),
  putBack: (input: ReturnInput) => request<StockResultDto>('POST', '/stock/return', input),
  move: (input: MoveInput) => request<StockResultDto>('POST', '/stock/move', input),
  adjust: (input: AdjustInput) => request<StockResultDto>('POST', '/stock/adjust', input),
  count: (input: CountInput) => request<StockResultDto>('POST', '/stock/count', input),
}
