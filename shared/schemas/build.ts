import { z } from 'zod'
import { BUILD_STATUSES } from '../types/domain'
import { MAX_QUANTITY, isoDate } from './stock'
import { MAX_MM } from './part'

/** Most pieces one bar line may ask for: a cutting list longer than this is several lines. */
export const MAX_PIECES = 100
/** Most lines one paste or CSV import may add at once. */
export const MAX_IMPORT_LINES = 500

const text = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`)
const positiveId = z.number().int().positive()
const quantity = z.number({ error: 'quantity must be a number' })
  .positive('quantity must be above 0').max(MAX_QUANTITY, `quantity must be at most ${MAX_QUANTITY}`)

export const buildInput = z.object({
  name: text(160).min(1, 'name is required'),
  description: text(4000).default(''),
  targetDate: isoDate.nullable().default(null),
  /** Storekeepers and admins may open a build for another member; builders own what they open. */
  ownerId: positiveId.optional(),
}).strict()
export type BuildInput = z.input<typeof buildInput>

export const buildPatch = z.object({
  name: text(160).min(1, 'name is required').optional(),
  description: text(4000).optional(),
  targetDate: isoDate.nullable().optional(),
  ownerId: positiveId.optional(),
}).strict()
export type BuildPatch = z.input<typeof buildPatch>

export const buildListQuery = z.object({
  status: z.enum(BUILD_STATUSES).optional(),
  mine: z.enum(['true', 'false']).transform((s) => s === 'true').optional(),
  q: text(100).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
})

/** Moving to finished or shelved releases what is still reserved; `confirm` says the user saw the list. */
export const statusInput = z.object({
  status: z.enum(BUILD_STATUSES),
  confirm: z.boolean().default(false),
}).strict()
export type StatusInput = z.input<typeof statusInput>

/** A BOM line: count, or for bar stock the finished length of each piece (mm) and how many pieces. */
export const lineInput = z.object({
  partId: positiveId,
  quantity,
  pieces: z.number().int().min(1).max(MAX_PIECES).default(1),
  note: text(200).default(''),
}).strict()
export type LineInput = z.input<typeof lineInput>

export const linePatch = z.object({
  quantity: quantity.optional(),
  pieces: z.number().int().min(1).max(MAX_PIECES).optional(),
  note: text(200).optional(),
  position: z.number().int().min(0).max(10_000).optional(),
}).strict()
export type LinePatch = z.input<typeof linePatch>

/** Paste or CSV: `code,quantity,note` (pieces optional); dryRun shows what would be added. */
export const importInput = z.object({
  text: z.string().max(200_000, 'the text is too long (200 000 characters at most)'),
  dryRun: z.boolean().default(true),
}).strict()
export type ImportInput = z.input<typeof importInput>

export const copyLinesInput = z.object({
  fromBuildId: positiveId,
  lineIds: z.array(positiveId).max(MAX_IMPORT_LINES).optional(),
}).strict()
export type CopyLinesInput = z.input<typeof copyLinesInput>

/**
 * Reserve one line (lineId) or every line (no lineId). `quantity` (one line only) reserves that
 * much instead of all that is outstanding. With allowPartial, what there is is reserved and the
 * rest recorded as a shortage; without it, a request that exceeds the free stock changes nothing.
 */
export const reserveInput = z.object({
  lineId: positiveId.optional(),
  quantity: quantity.optional(),
  allowPartial: z.boolean().default(false),
}).strict().refine((r) => r.quantity === undefined || r.lineId !== undefined, {
  message: 'quantity needs a lineId', path: ['quantity'],
})
export type ReserveInput = z.input<typeof reserveInput>

export const releaseInput = z.object({
  lineId: positiveId.optional(),
}).strict()
export type ReleaseInput = z.input<typeof releaseInput>

/**
 * Draw for a line. Counted and batch parts: `quantity` from `binId` (or wherever it lies,
 * first-expiry-first-out for batches). Bar lines: `pieces` cuts (default: all not cut yet), from
 * the piece `lotId` when given, else where the cutting plan puts them.
 */
export const drawInput = z.object({
  lineId: positiveId,
  quantity: quantity.optional(),
  binId: positiveId.optional(),
  lotId: positiveId.optional(),
  pieces: z.number().int().min(1).max(MAX_PIECES).optional(),
  reason: text(300).default(''),
}).strict()
export type DrawInput = z.input<typeof drawInput>

/** Unused parts back to a bin; for bar lines `quantity` is the returned piece's length in mm. */
export const returnInput = z.object({
  lineId: positiveId,
  binId: positiveId,
  quantity: z.number().positive('quantity must be above 0').max(Math.max(MAX_QUANTITY, MAX_MM)),
  reason: text(300).default(''),
}).strict()
export type ReturnInput = z.input<typeof returnInput>

export const reservationsQuery = z.object({
  partId: z.coerce.number().int().positive(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(50),
})

export const shortagesQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(100),
})

export const lineParams = z.object({
  id: z.coerce.number().int().positive(),
  lineId: z.coerce.number().int().positive(),
})
