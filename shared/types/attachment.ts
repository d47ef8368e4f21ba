/** Drawings and sketches attached to a part or a build. */
export const ATTACHMENT_OWNER_TYPES = ['part', 'build'] as const
export type AttachmentOwnerType = (typeof ATTACHMENT_OWNER_TYPES)[number]

/**
 * pending → ready or failed while the thumbnail worker runs; 'none' for files that get no
 * thumbnail (PDF drawings, and WebP, which jimp 1.6 cannot decode).
 */
export type ThumbStatus = 'pending' | 'ready' | 'failed' | 'none'

/** The thumbnail widths made for every image, in pixels (gallery grid and full-size view). */
export const THUMB_WIDTHS = [160, 800] as const
export type ThumbWidth = (typeof THUMB_WIDTHS)[number]

/** Types accepted, judged from the file's bytes; anything else is refused with 415. */
export const ACCEPTED_MIME_TYPES = [
  'image/png',
  'image/jpeg',
  'image/webp',
  'image/gif',
  'application/pdf',
] as const
export type AcceptedMime = (typeof ACCEPTED_MIME_TYPES)[number]

export interface AttachmentDto {
  id: number
  ownerType: AttachmentOwnerType
  ownerId: number
  /** The uploader's file name, for display only. */
  originalName: string
  mime: AcceptedMime
  /** 'image' gets thumbnails; 'pdf' is shown as a document icon. */
  kind: 'image' | 'pdf'
  sizeBytes: number
  thumbStatus: ThumbStatus
  uploadedById: number
  uploadedByName: string
  createdAt: string
  /** Paths under /api. */
  fileUrl: string
  /** Set when thumbStatus is 'ready'. */
  thumbUrls: { 160: string; 800: string } | null
}

/** What the client shows beside the upload button. */
export interface UploadRulesDto {
  maxBytes: number
  acceptedTypes: AcceptedMime[]
}
