import { z } from 'zod'

/** Longest lead time accepted: a year is already unusual for a model-engineering supplier. */
export const MAX_LEAD_TIME_DAYS = 365
/** Largest pack or price accepted: a guard against typing slips, not a business rule. */
export const MAX_PACK = 1_000_000

const email = z.union([z.literal(''), z.email('must be an e-mail address')])
const website = z.union([z.literal(''), z.url('must be a web address (https://…)')])

export const supplierInput = z.object({
  name: z.string().trim().min(1, 'name is required').max(160),
  email: email.default(''),
  website: website.default(''),
  leadTimeDays: z.number().int('whole days').min(0, 'cannot be negative').max(MAX_LEAD_TIME_DAYS).default(7),
  notes: z.string().max(2000).default(''),
}).strict()
export type SupplierInput = z.input<typeof supplierInput>
export const supplierPatch = supplierInput.partial().strict()
export type SupplierPatch = z.input<typeof supplierPatch>

export const offerInput = z.object({
  partId: z.number().int().positive(),
  supplierCode: z.string().trim().max(64).default(''),
  packSize: z.number().positive('must be above 0').max(MAX_PACK),
  packPrice: z.number().min(0, 'cannot be negative').max(MAX_PACK),
}).strict()
export type OfferInput = z.input<typeof offerInput>
export const offerPatch = offerInput.omit({ partId: true }).partial().strict()
export type OfferPatch = z.input<typeof offerPatch>

/** A part's reorder rules, set by hand (or by pressing "use these" on the suggestion). */
export const reorderRulesInput = z.object({
  reorderPoint: z.number().min(0, 'cannot be negative').max(MAX_PACK).optional(),
  reorderQuantity: z.number().min(0, 'cannot be negative').max(MAX_PACK).optional(),
  preferredSupplierId: z.number().int().positive().nullable().optional(),
}).strict()
export type ReorderRulesInput = z.input<typeof reorderRulesInput>

/** Usage windows offered on the part page, in days. */
export const USAGE_WINDOWS = [30, 90, 180, 365] as const

/** Query of the reorder suggestion: everything optional, numbers arrive as text. */
export const suggestionQuery = z.object({
  windowDays: z.coerce.number().int().min(7, 'at least 7 days').max(730, 'at most 730 days').default(90),
  leadTimeDays: z.coerce.number().int().min(0).max(MAX_LEAD_TIME_DAYS).optional(),
  safetyStock: z.coerce.number().min(0).max(MAX_PACK).optional(),
  orderCost: z.coerce.number().min(0).max(MAX_PACK).optional(),
  holdingRate: z.coerce.number().min(0).max(5).optional(),
})
/** What the client sends (query strings carry numbers as text; the route coerces them). */
export type SuggestionQuery = Partial<z.output<typeof suggestionQuery>>

export const listQuery = z.object({
  q: z.string().trim().max(100).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
})
export { idParam } from './user'
