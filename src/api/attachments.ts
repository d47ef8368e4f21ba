import { query, request } from './http'
import type { Page } from '../../shared/types/api'
import type {
  AttachmentDto, AttachmentOwnerType, UploadRulesDto,
} from '../../shared/types/attachment'

export type { AttachmentDto, AttachmentOwnerType, UploadRulesDto }

export const attachmentsApi = {
  /** Drawings and sketches of one part or build, oldest first. */
  list: (ownerType: AttachmentOwnerType, ownerId: number) =>
    request<Page<AttachmentDto>>('GET', `/attachments${query({ ownerType, ownerId, pageSize: 200 })}`),
  get: (id: number) => request<AttachmentDto>('GET', `/attachments/${id}`),
  /** The size limit and accepted types, shown beside the upload button. */
  rules: () => request<UploadRulesDto>('GET', '/attachments/rules'),
  upload: (ownerType: AttachmentOwnerType, ownerId: number, file: File) => {
    const form = new FormData()
    form.append('file', file)
    return request<AttachmentDto>('POST', `/attachments${query({ ownerType, ownerId })}`, form)
  },
  remove: (id: number) => request<void>('DELETE', `/attachments/${id}`),
}
