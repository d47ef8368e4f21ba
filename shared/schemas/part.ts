import { z } from 'zod'

/** Upper bound for any length or size typed in mm: a 6 m bar is the longest stock length sold. */
export const MAX_MM = 10_000

const mm = (what: string) =>
  z.number({ error: `${what} must be a number of mm` }).positive(`${what} must be above 0 mm`).max(MAX_MM, `${what} must be at most ${MAX_MM} mm`)
const text = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`)

export const FASTENER_TYPES = ['stud', 'nut', 'screw', 'bolt', 'washer', 'pin'] as const
export const STOCK_SECTIONS = ['round', 'hex', 'square', 'flat', 'tube', 'sheet'] as const

export const fastenerAttributes = z.object({
  kind: z.literal('fastener'),
  type: z.enum(FASTENER_TYPES),
  /** Thread designation as the trade writes it: 7BA, M3, M4x0.5, 5/32-40 ME, 1/4-20 UNC. */
  thread: text(32).min(1, 'thread is required'),
  lengthMm: mm('Length').nullable().optional(),
  material: text(40).min(1, 'material is required'),
  finish: text(40).optional(),
  head: text(40).optional(),
  drive: text(40).optional(),
})

export const gasketAttributes = z.object({
  kind: z.literal('gasket'),
  material: text(40).min(1, 'material is required'),
  thicknessMm: mm('Thickness'),
  innerMm: mm('Inner size').nullable().optional(),
  outerMm: mm('Outer size').nullable().optional(),
  shape: text(60).optional(),
})

export const stockAttributes = z.object({
  kind: z.literal('stock'),
  material: text(40).min(1, 'material is required'),
  section: z.enum(STOCK_SECTIONS),
  /** Diameter (round, tube OD), across flats (hex), side (square) or width (flat, sheet). */
  sizeMm: mm('Size'),
  thicknessMm: mm('Thickness').nullable().optional(),
  wallMm: mm('Wall').nullable().optional(),
})

export const compoundAttributes = z.object({
  kind: z.literal('compound'),
  /** What it is, in plain words: "medium-strength thread-locker", "steam cylinder oil". */
  grade: text(80).min(1, 'grade description is required'),
  containerSize: text(40).min(1, 'container size is required'),
  /** Has a safety data sheet with skin/eye hazards (thread-lockers, retaining compounds). */
  hazardous: z.boolean().default(false),
})

export const otherAttributes = z.object({
  kind: z.literal('other'),
  properties: z.record(z.string().max(40), z.string().max(120)).default({}),
})

/** One schema per kind, chosen by `kind`: shared by the part form and POST/PATCH /api/parts. */
export const partAttributes = z.discriminatedUnion('kind', [
  fastenerAttributes, gasketAttributes, stockAttributes, compoundAttributes, otherAttributes,
])
export type PartAttributes = z.infer<typeof partAttributes>

export const partInput = z.object({
  code: z.string().trim().toUpperCase().regex(/^[A-Z0-9./×x-]{2,48}$/i, 'may use letters, digits, dot, slash and dash (2–48)').optional(),
  name: text(200).min(1, 'name is required'),
  unit: text(16).min(1).optional(),
  notes: text(4000).default(''),
  tags: z.array(text(30).min(1)).max(20).default([]),
  reorderPoint: z.number().min(0).max(1e7).default(0),
  reorderQuantity: z.number().min(0).max(1e7).default(0),
  preferredSupplierId: z.number().int().positive().nullable().default(null),
  unitCost: z.number().min(0).max(1e6).default(0),
  pressureBearing: z.boolean().default(false),
  attributes: partAttributes,
}).strict()
export type PartInput = z.input<typeof partInput>
export type PartInputParsed = z.infer<typeof partInput>
