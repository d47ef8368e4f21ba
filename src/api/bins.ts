import { request } from './http'
import type { BinContentsDto, BinDto, PlaceTreeDto, RackDto, WorkshopDto } from '../../shared/types/stock'
import type { BinCreateInput, BinUpdateInput, RackInput, WorkshopInput } from '../../shared/schemas/stock'

/** Places: workshops → racks → bins. */
export const binsApi = {
  tree: () => request<PlaceTreeDto>('GET', '/bins'),
  /** By human code (A3-07) or label code. */
  contents: (code: string) => request<BinContentsDto>('GET', `/bins/${encodeURIComponent(code)}`),
  create: (input: BinCreateInput) => request<BinDto>('POST', '/bins', input),
  update: (id: number, input: BinUpdateInput) => request<BinDto>('PATCH', `/bins/${id}`, input),
  retire: (id: number) => request<BinDto>('POST', `/bins/${id}/retire`),
  unretire: (id: number) => request<BinDto>('POST', `/bins/${id}/unretire`),
  createRack: (input: RackInput) => request<RackDto>('POST', '/racks', input),
  updateRack: (id: number, input: Partial<RackInput>) => request<RackDto>('PATCH', `/racks/${id}`, input),
  createWorkshop: (input: WorkshopInput) => request<WorkshopDto>('POST', '/workshops', input),
  renameWorkshop: (id: number, input: WorkshopInput) => request<WorkshopDto>('PATCH', `/workshops/${id}`, input),
}
