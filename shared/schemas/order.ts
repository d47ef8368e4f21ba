import { z } from 'zod'
import { isoDate, MAX_QUANTITY } from './stock'
import { ORDER_STATUSES } from '../types/domain'

/** Most lines one order may carry: a guard against runaway requests, not a business rule. */
export const MAX_ORDER_LINES = 200
/** Most packs of one line: beyond any model-engineering order. */
export const MAX_PACKS = 10_000

const id = z.number().int().positive()

export const orderLineInput = z.object({
  partId: id,
  packs: z.number().int('whole packs').min(1, 'at least one pack').max(MAX_PACKS),
  /** Defaults to the supplier's offer (or 1 when the supplier has no offer for the part). */
  packSize: z.number().positive('must be above 0').max(MAX_QUANTITY).optional(),
  packPrice: z.number().min(0, 'cannot be negative').max(MAX_QUANTITY).optional(),
}).strict()
export type OrderLineInput = z.input<typeof orderLineInput>

const lines = z.array(orderLineInput).min(1, 'add at least one line').max(MAX_ORDER_LINES)
  .refine((ls) => new Set(ls.map((l) => l.partId)).size === ls.length, 'each part once per order')

export const orderCreateInput = z.object({
  supplierId: id,
  lines,
  notes: z.string().max(2000).default(''),
  expectedOn: isoDate.nullable().optional(),
}).strict()
export type OrderCreateInput = z.input<typeof orderCreateInput>

/** Changes to a draft; `lines` replaces all lines. */
export const orderPatchInput = z.object({
  lines: lines.optional(),
  notes: z.string().max(2000).optional(),
  expectedOn: isoDate.nullable().optional(),
}).strict()
export type OrderPatchInput = z.input<typeof orderPatchInput>

/** One receipt against an order line: counted items, batch containers, or bar pieces of a length. */
export const receiptLineInput = z.object({
  lineId: id,
  binId: id,
  /** Items or containers; for bar stock the length of each piece in mm. */
  quantity: z.number().positive('must be above 0').max(MAX_QUANTITY),
  /** Bar stock: how many pieces of `quantity` mm. */
  pieces: z.number().int().min(1).max(100).default(1),
  batchCode: z.string().trim().max(48).optional(),
  expiresOn: isoDate.optional(),
}).strict()
export type ReceiptLineInput = z.input<typeof receiptLineInput>

export const orderReceiveInput = z.object({
  lines: z.array(receiptLineInput).min(1, 'receive at least one line').max(MAX_ORDER_LINES),
  /** Receiving more than was ordered must be confirmed: true says "yes, more came". */
  confirmOverReceipt: z.boolean().default(false),
}).strict()
export type OrderReceiveInput = z.input<typeof orderReceiveInput>

export const OPEN_FILTER = 'open'
export const orderListQuery = z.object({
  status: z.enum([...ORDER_STATUSES, OPEN_FILTER]).optional(),
  supplierId: z.coerce.number().int().positive().optional(),
  late: z.stringbool().optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})
export type OrderListQuery = Partial<z.output<typeof orderListQuery>>
