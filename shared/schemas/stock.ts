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

const id = z.number().int().positive()
const reasonText = z.string().trim().max(300)
/** A reason someone can read later in the ledger: at least a few letters, not just "x". */
const requiredReason = reasonText.min(3, 'give a reason (at least 3 characters)')
const amount = z.number().positive('must be above 0').max(MAX_QUANTITY)

/**
 * Take from stock (a plain take from a bin, or a build draw when buildId is given).
 * Counted parts: items; bar: the length in mm cut from one piece; batches: containers, FEFO.
 */
export const takeInput = z.object({
  partId: id,
  binId: id.optional(),
  /** A chosen bar piece or batch; otherwise the service chooses (FEFO, shortest piece that fits). */
  lotId: id.optional(),
  quantity: amount,
  buildId: id.optional(),
  reason: reasonText.default(''),
  /** Storekeeper override: draw from an expired batch (the reason is recorded). */
  allowExpired: z.boolean().default(false),
  /** Storekeeper override: a plain take that eats into stock reserved for builds. */
  allowReserved: z.boolean().default(false),
  /** Bar stock: saw kerf lost in the cut, recorded as its own movement. */
  kerfMm: z.number().min(0).max(20).optional(),
}).strict()
export type TakeInput = z.input<typeof takeInput>

/** Put parts back into a bin (unused parts from a build, an offcut coming back). */
export const returnInput = z.object({
  partId: id,
  binId: id,
  quantity: amount,
  /** Batches: the batch the container came from (or give batchCode + expiresOn). */
  lotId: id.optional(),
  batchCode: z.string().trim().max(48).optional(),
  expiresOn: isoDate.optional(),
  buildId: id.optional(),
  reason: reasonText.default(''),
}).strict()
export type ReturnInput = z.input<typeof returnInput>

/**
 * Move stock to another bin: a counted quantity of a part (partId + fromBinId), or one lot
 * (a whole bar piece, or some containers of one batch).
 */
export const moveInput = z.object({
  partId: id.optional(),
  fromBinId: id.optional(),
  lotId: id.optional(),
  toBinId: id,
  /** Omit to move the whole lot. */
  quantity: amount.optional(),
  reason: reasonText.default(''),
}).strict().refine((m) => m.lotId || (m.partId && m.fromBinId), {
  message: 'give the lot, or the part and the bin it comes from', path: ['lotId'],
})
export type MoveInput = z.input<typeof moveInput>

/** Correct a lot by a signed difference (storekeeper; the reason goes in the ledger). */
export const adjustInput = z.object({
  /** Bar pieces and batches: the lot; counted parts may give partId + binId instead. */
  lotId: id.optional(),
  partId: id.optional(),
  binId: id.optional(),
  delta: z.number().min(-MAX_QUANTITY).max(MAX_QUANTITY).refine((d) => d !== 0, 'must not be 0'),
  reason: requiredReason,
}).strict().refine((a) => a.lotId || (a.partId && a.binId), {
  message: 'give the lot, or the part and the bin', path: ['lotId'],
})
export type AdjustInput = z.input<typeof adjustInput>

/** One counted line of a stock-take: an existing lot, or a part found in the bin. */
export const countLine = z.object({
  lotId: id.optional(),
  partId: id.optional(),
  counted: z.number().min(0).max(MAX_QUANTITY),
  /** A batch found that the bin had no record of. */
  batchCode: z.string().trim().max(48).optional(),
  expiresOn: isoDate.optional(),
}).strict().refine((l) => l.lotId || l.partId, { message: 'give the lot or the part', path: ['lotId'] })

/** Stock-take of one bin: lines not listed are left as they are; equal counts write nothing. */
export const countInput = z.object({
  binId: id,
  lines: z.array(countLine).min(1).max(500),
  reason: reasonText.default('Stock-take'),
}).strict()
export type CountInput = z.input<typeof countInput>

export const reverseInput = z.object({ reason: reasonText.default('') }).strict()
export type ReverseInput = z.input<typeof reverseInput>

/** Filters of GET /api/movements and its CSV export (query-string values). */
export const movementQuery = z.object({
  part: z.coerce.number().int().positive().optional(),
  bin: z.coerce.number().int().positive().optional(),
  user: z.coerce.number().int().positive().optional(),
  kind: z.enum(['receive', 'draw', 'return', 'move', 'adjust', 'count']).optional(),
  build: z.coerce.number().int().positive().optional(),
  purchaseOrder: z.coerce.number().int().positive().optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})
export type MovementQuery = z.input<typeof movementQuery>

/** A bin's human code: rack code, dash, number, e.g. "A3-07" (letters, digits, dashes). */
export const binCode = z.string().trim().toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9-]{0,22}[A-Z0-9]$/, 'use letters, digits and dashes, e.g. A3-07')

export const binCreateInput = z.object({
  code: binCode,
  rackId: id,
  description: z.string().trim().max(200).default(''),
}).strict()
export type BinCreateInput = z.input<typeof binCreateInput>

export const binUpdateInput = z.object({
  code: binCode.optional(),
  rackId: id.optional(),
  description: z.string().trim().max(200).optional(),
  defaultPartId: id.nullable().optional(),
}).strict()
export type BinUpdateInput = z.input<typeof binUpdateInput>

export const rackInput = z.object({
  code: z.string().trim().toUpperCase().regex(/^[A-Z0-9]{1,16}$/, 'use letters and digits, e.g. A3'),
  name: z.string().trim().min(1).max(120),
  workshopId: id,
}).strict()
export type RackInput = z.input<typeof rackInput>
export const rackUpdateInput = rackInput.partial().strict()

export const workshopInput = z.object({ name: z.string().trim().min(1).max(120) }).strict()
export type WorkshopInput = z.input<typeof workshopInput>
