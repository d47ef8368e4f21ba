/**
 * Inputs of the workshop calculators: used by /api/calc/* (query strings, so numbers arrive as text)
 * and by the workbench forms. Every number is checked for being a number, its sign and an upper bound.
 */
import { z } from 'zod'
import { SECTION_SHAPES, sectionProblem, type BarSection } from '../domain/bar'
import { MATERIALS, findMaterial } from '../domain/materials'

/** Largest bar section accepted, mm: nothing a model workshop saws is a metre across. */
export const MAX_SECTION_MM = 1000
/** Longest length accepted, mm: 20 m is well past the 6 m bars suppliers sell. */
export const MAX_LENGTH_MM = 20_000
/** Density bounds, kg/m³: cork is lighter, osmium (22 590) is the densest element. */
export const MIN_DENSITY = 100
export const MAX_DENSITY = 23_000
/** Largest price, weight or count accepted: a guard against typing slips, not a business rule. */
export const MAX_AMOUNT = 1_000_000_000
/** Widest saw kerf and deepest facing allowance accepted, mm: a parting tool is 2–3 mm wide. */
export const MAX_KERF_MM = 10
export const MAX_FACING_MM = 20
/** Size limits of one cutting list, so the planner answers in well under a second. */
export const MAX_STOCK_PIECES = 200
export const MAX_CUT_PIECES = 2000

/** Query strings give text, cleared form inputs give null; blanks and nulls count as "not given". */
const toNumber = (v: unknown) => {
  if (v === null) return undefined
  return typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim())) : v
}

interface NumberRule {
  unit?: string
  max?: number
  /** Zero is meaningful (a tare, a kerf, a safety stock). */
  allowZero?: boolean
  integer?: boolean
}

function numberCheck(label: string, { unit = '', max = MAX_AMOUNT, allowZero = false, integer = false }: NumberRule) {
  const u = unit ? ` ${unit}` : ''
  let n = z.number({ error: (iss) => (iss.input === undefined ? `${label} is required` : `${label} must be a number`) })
  n = allowZero ? n.min(0, `${label} cannot be negative`) : n.positive(`${label} must be more than 0${u}`)
  n = n.max(max, `${label} must be at most ${max}${u}`)
  return integer ? n.int(`${label} must be a whole number`) : n
}

/** A required number field. */
export const num = (label: string, rule: NumberRule = {}) => z.preprocess(toNumber, numberCheck(label, rule))
/** An optional number field: absent or blank means not given. */
export const optNum = (label: string, rule: NumberRule = {}) => z.preprocess(toNumber, numberCheck(label, rule).optional())

export const CLEARANCE_FITS = ['close', 'medium'] as const

export const threadQuery = z.object({
  designation: z.string({ error: 'designation is required' }).trim().min(1, 'designation is required').max(40, 'designation is too long'),
  fit: z.enum(CLEARANCE_FITS, { error: 'fit must be close or medium' }).default('medium'),
})
export type ThreadQuery = z.infer<typeof threadQuery>

export const drillQuery = z.object({
  name: z.string({ error: 'name is required' }).trim().min(1, 'name is required').max(20, 'name is too long'),
})

/** A workshop's drill set as stored in settings: drill names as parseDrill reads them. */
export const drillSetSetting = z.array(z.string().trim().min(1).max(20)).min(1, 'the drill set is empty').max(2000)

const size = (label: string) => optNum(label, { unit: 'mm', max: MAX_SECTION_MM })

export const barQuery = z
  .object({
    section: z.enum(SECTION_SHAPES, { error: `section must be one of ${SECTION_SHAPES.join(', ')}` }),
    material: z.string().trim().max(60).optional(),
    density: optNum('Density', { unit: 'kg/m³', max: MAX_DENSITY }),
    size: size('Size'),
    width: size('Width'),
    thickness: size('Thickness'),
    outside: size('Outside diameter'),
    wall: size('Wall'),
    lengthMm: optNum('Length', { unit: 'mm', max: MAX_LENGTH_MM }),
    pricePerKg: optNum('Price per kg'),
    pricePerMetre: optNum('Price per metre'),
  })
  .superRefine((q, ctx) => {
    const need = (field: keyof typeof q, label: string) => {
      if (q[field] === undefined) ctx.addIssue({ code: 'custom', path: [field], message: `${label} is required for ${q.section} bar` })
    }
    if (q.section === 'flat') { need('width', 'Width'); need('thickness', 'Thickness') }
    else if (q.section === 'tube') {
      if (q.outside === undefined && q.size === undefined) need('outside', 'Outside diameter')
      need('wall', 'Wall')
    } else need('size', 'Size')
    if (q.material && !findMaterial(q.material)) {
      ctx.addIssue({ code: 'custom', path: ['material'], message: `Unknown material "${q.material}"; known: ${MATERIALS.map((m) => m.id).join(', ')}` })
    }
    if (!q.material && q.density === undefined) ctx.addIssue({ code: 'custom', path: ['material'], message: 'Give a material or a density' })
    if (q.density !== undefined && q.density < MIN_DENSITY) ctx.addIssue({ code: 'custom', path: ['density'], message: `Density must be at least ${MIN_DENSITY} kg/m³` })
    if (q.pricePerKg !== undefined && q.pricePerMetre !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['pricePerMetre'], message: 'Give a price per kg or per metre, not both' })
    }
    const s = toSection(q)
    const problem = s && sectionProblem(s)
    if (problem) ctx.addIssue({ code: 'custom', path: ['wall'], message: problem })
  })
  .transform((q) => {
    const material = q.material ? findMaterial(q.material) ?? null : null
    return {
      section: toSection(q)!,
      material,
      densityKgM3: q.density ?? material!.densityKgM3,
      lengthMm: q.lengthMm ?? 1000,
      pricePerKg: q.pricePerKg,
      pricePerMetre: q.pricePerMetre,
    }
  })
export type BarQuery = z.output<typeof barQuery>

type BarFields = { section: BarSection['shape']; size?: number; width?: number; thickness?: number; outside?: number; wall?: number }

/** The flat query fields as a typed section (null while a needed size is missing). */
function toSection(q: BarFields): BarSection | null {
  switch (q.section) {
    case 'round': return q.size === undefined ? null : { shape: 'round', diameterMm: q.size }
    case 'hex': return q.size === undefined ? null : { shape: 'hex', acrossFlatsMm: q.size }
    case 'square': return q.size === undefined ? null : { shape: 'square', sideMm: q.size }
    case 'flat': return q.width === undefined || q.thickness === undefined ? null : { shape: 'flat', widthMm: q.width, thicknessMm: q.thickness }
    case 'tube': {
      const outside = q.outside ?? q.size
      return outside === undefined || q.wall === undefined ? null : { shape: 'tube', outsideMm: outside, wallMm: q.wall }
    }
  }
}

export const cuttingListInput = z
  .object({
    stock: z.array(z.object({
      id: z.string().trim().min(1, 'each stock piece needs an id').max(40),
      lengthMm: num('Stock length', { unit: 'mm', max: MAX_LENGTH_MM }),
    })).min(1, 'give at least one stock piece').max(MAX_STOCK_PIECES, `at most ${MAX_STOCK_PIECES} stock pieces`),
    cuts: z.array(z.object({
      label: z.string().trim().min(1, 'each cut needs a label').max(60),
      lengthMm: num('Cut length', { unit: 'mm', max: MAX_LENGTH_MM }),
      qty: num('Quantity', { max: MAX_CUT_PIECES, integer: true }),
    })).min(1, 'give at least one cut').max(100, 'at most 100 different cuts'),
    kerfMm: num('Kerf', { unit: 'mm', max: MAX_KERF_MM, allowZero: true }),
    facingMm: num('Facing allowance', { unit: 'mm', max: MAX_FACING_MM, allowZero: true }).default(0),
    minOffcutMm: optNum('Shortest useful offcut', { unit: 'mm', max: MAX_LENGTH_MM, allowZero: true }),
  })
  .refine((i) => i.cuts.reduce((t, c) => t + c.qty, 0) <= MAX_CUT_PIECES, {
    path: ['cuts'], message: `at most ${MAX_CUT_PIECES} pieces in one list`,
  })
export type CuttingListInput = z.output<typeof cuttingListInput>

export const countByWeightQuery = z.object({
  sampleCount: num('Sample count', { max: MAX_AMOUNT, integer: true }),
  sampleWeightG: num('Sample weight', { unit: 'g', max: MAX_AMOUNT }),
  totalWeightG: num('Total weight', { unit: 'g', max: MAX_AMOUNT }),
  tareG: optNum('Tare', { unit: 'g', max: MAX_AMOUNT, allowZero: true }),
  scaleResolutionG: num('Scale resolution', { unit: 'g', max: 1000 }),
}).superRefine((q, ctx) => {
  if (q.tareG !== undefined && q.tareG >= q.totalWeightG) ctx.addIssue({ code: 'custom', path: ['tareG'], message: 'Tare must be less than the total weight' })
  if (q.scaleResolutionG >= q.sampleWeightG) ctx.addIssue({ code: 'custom', path: ['scaleResolutionG'], message: 'The scale resolution must be finer than the sample weight' })
})

export const reorderPointQuery = z.object({
  dailyDemand: num('Daily demand', { unit: 'a day', max: MAX_AMOUNT }),
  leadTimeDays: num('Lead time', { unit: 'days', max: 3650 }),
  safetyStock: optNum('Safety stock', { max: MAX_AMOUNT, allowZero: true }),
})

export const eoqQuery = z.object({
  annualDemand: num('Annual demand', { max: MAX_AMOUNT }),
  orderCost: num('Order cost', { max: MAX_AMOUNT }),
  holdingCostPerUnitYear: num('Holding cost per unit per year', { max: MAX_AMOUNT }),
  packSize: optNum('Pack size', { max: 1_000_000, integer: true }),
  workingDays: optNum('Working days', { unit: 'days', max: 366, integer: true }),
})
