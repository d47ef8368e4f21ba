import { z } from 'zod'
import { MAX_QUANTITY, isoDate } from './stock'

const id = z.number().int().positive()

/** One counted line: an existing lot (with the quantity the counter saw on record), or a part found. */
export const stockTakeLine = z.object({
  lotId: id.optional(),
  partId: id.optional(),
  counted: z.number().min(0).max(MAX_QUANTITY),
  /** The record when the bin was counted; a lot that changed since is refused as stale. */
  expected: z.number().min(0).max(MAX_QUANTITY).optional(),
  batchCode: z.string().trim().max(48).optional(),
  expiresOn: isoDate.optional(),
}).strict().refine((l) => l.lotId || l.partId, { message: 'give the lot or the part', path: ['lotId'] })

/** A stock-take over several bins, applied together: every bin's differences or none. */
export const stockTakeInput = z.object({
  bins: z.array(z.object({ binId: id, lines: z.array(stockTakeLine).max(500) }).strict()).min(1).max(500),
  reason: z.string().trim().min(3, 'give a reason (at least 3 characters)').max(300).default('Stock-take'),
}).strict()
export type StockTakeInput = z.input<typeof stockTakeInput>
