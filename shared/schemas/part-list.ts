import { z } from 'zod'
import { PART_KINDS } from '../types/domain'

/** Rows per page unless asked otherwise, and the most one page may hold. */
export const DEFAULT_PAGE_SIZE = 25
export const MAX_PAGE_SIZE = 100

/** GET /api/parts query string. */
export const partListQuery = z.object({
  q: z.string().trim().max(120, 'q must be at most 120 characters').default(''),
  kind: z.enum(PART_KINDS).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE).default(DEFAULT_PAGE_SIZE),
  includeArchived: z.stringbool().default(false),
})
export type PartListQuery = z.input<typeof partListQuery>
