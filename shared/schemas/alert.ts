import { z } from 'zod'
import { ALERT_KINDS } from '../types/domain'

export const alertQuery = z.object({
  /** true (default): open alerts only; false: resolved ones too. */
  open: z.stringbool().default(true),
  kind: z.enum(ALERT_KINDS).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})
