import { request, requestBlob } from './http'
import type { LabelItemsDto } from '../../shared/types/labels'
import type { LabelPdfInput, LabelSelection } from '../../shared/schemas/labels'

/** Label contents for the preview, and the printable PDF (storekeepers). */
export const labelsApi = {
  items: (selection: LabelSelection) => request<LabelItemsDto>('POST', '/labels/items', selection),
  pdf: (input: LabelPdfInput) => requestBlob('POST', '/labels/pdf', input),
}
