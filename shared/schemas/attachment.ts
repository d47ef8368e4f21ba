import { z } from 'zod'
import { ATTACHMENT_OWNER_TYPES } from '../types/attachment'

/** Which part or build an attachment belongs to (query string of upload and list). */
export const attachmentOwner = z.object({
  ownerType: z.enum(ATTACHMENT_OWNER_TYPES),
  ownerId: z.coerce.number().int().positive(),
})
export type AttachmentOwner = z.infer<typeof attachmentOwner>

/** Largest page of attachments one list call returns. */
export const MAX_ATTACHMENT_PAGE = 200

export const attachmentListQuery = attachmentOwner.extend({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(MAX_ATTACHMENT_PAGE).default(60),
})

export const attachmentId = z.coerce.number().int().positive()
