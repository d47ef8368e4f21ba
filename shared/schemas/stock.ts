import { z } from 'zod'
import { MAX_MM } from './part'

/** Largest quantity one movement may carry: far above any workshop's stock, far below float trouble. */
export const MAX_QUANTITY = 1_000_000

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(s)), 'is not a real date')

/** Receive stock into a bin: a count, a bar piece's length (mm), or a batch with its expiry. */
export const receiveInput = z.object({
  partId: z.number().int().positive(),
  binId: z.number().int().positive(),
  /** Counted parts: items; bar stock: length of each piece in mm; batches: containers. */
  quantity: z.number().positive('must be above 0').max(MAX_QUANTITY),
  /** Bar stock only: how many pieces of `quantity` mm arrive (each becomes its own piece). */
  pieces: z.number().int().min(1).max(100).default(1),
  batchCode: z.string().trim().max(48).optional(),
  expiresOn: isoDate.optional(),
  reason: z.string().trim().max(300).default(''),
  purchaseOrderId: z.number().int().positive().optional(),
}).strict()
export type ReceiveInput = z.input<typeof receiveInput>

export { isoDate, MAX_MM }
