/** Bar stock: cross-section area, mass and cost. Sizes in mm, densities in kg/m³. */

export type SectionShape = 'round' | 'hex' | 'square' | 'flat' | 'tube'
export const SECTION_SHAPES: readonly SectionShape[] = ['round', 'hex', 'square', 'flat', 'tube']

export type BarSection =
  | { shape: 'round'; diameterMm: number }
  | { shape: 'hex'; acrossFlatsMm: number }
  | { shape: 'square'; sideMm: number }
  | { shape: 'flat'; widthMm: number; thicknessMm: number }
  | { shape: 'tube'; outsideMm: number; wallMm: number }

/** Regular hexagon area = (√3/2)·AF², AF = across flats (plane geometry). */
export const HEX_AREA_FACTOR = Math.sqrt(3) / 2
/** Across corners of a regular hexagon = AF · 2/√3 ≈ 1.1547·AF. */
export const HEX_CORNERS_FACTOR = 2 / Math.sqrt(3)
/** mm² × mm × kg/m³ → kg: 1 mm³ = 1e-9 m³. */
const KG_PER_MM3_PER_KG_M3 = 1e-9
const MM_PER_M = 1000

/** Cross-section area in mm². A tube is π/4·(OD² − ID²) = π·t·(OD − t). */
export function sectionAreaMm2(s: BarSection): number {
  switch (s.shape) {
    case 'round':
      return (Math.PI / 4) * s.diameterMm ** 2
    case 'hex':
      return HEX_AREA_FACTOR * s.acrossFlatsMm ** 2
    case 'square':
      return s.sideMm ** 2
    case 'flat':
      return s.widthMm * s.thicknessMm
    case 'tube':
      return Math.PI * s.wallMm * (s.outsideMm - s.wallMm)
  }
}

/** Largest width of the section, which decides whether it passes the lathe spindle or fits a collet. */
export function sectionWidthMm(s: BarSection): number {
  switch (s.shape) {
    case 'round':
      return s.diameterMm
    case 'hex':
      return s.acrossFlatsMm * HEX_CORNERS_FACTOR
    case 'square':
      return s.sideMm * Math.SQRT2
    case 'flat':
      return Math.hypot(s.widthMm, s.thicknessMm)
    case 'tube':
      return s.outsideMm
  }
}

/** A section that cannot exist (a tube wall of half the diameter or more is a solid bar). */
export function sectionProblem(s: BarSection): string | null {
  if (s.shape === 'tube' && 2 * s.wallMm >= s.outsideMm) return 'The wall must be less than half the outside diameter.'
  return null
}

export interface BarInput {
  section: BarSection
  densityKgM3: number
  /** Piece length; the per-metre figures are given whatever it is. */
  lengthMm: number
  /** Price by weight or by length; give one or neither. */
  pricePerKg?: number
  pricePerMetre?: number
}

export interface BarResult {
  areaMm2: number
  massPerMetreKg: number
  massKg: number
  /** Width over corners: the diameter of bar a hexagon or square could be turned from. */
  acrossCornersMm?: number
  costPerMetre?: number
  cost?: number
}

const round = (x: number, places: number) => Number(x.toFixed(places))
/** Area to 0.01 mm²; mass to 0.1 g; money to the smallest coin. */
const AREA_PLACES = 2
const MASS_PLACES = 4
const MONEY_PLACES = 2

/** mass = A × L × ρ; cost = mass × price/kg, or length × price/m. */
export function barStock(input: BarInput): BarResult {
  const area = sectionAreaMm2(input.section)
  const perMetre = area * MM_PER_M * input.densityKgM3 * KG_PER_MM3_PER_KG_M3
  const mass = area * input.lengthMm * input.densityKgM3 * KG_PER_MM3_PER_KG_M3
  const result: BarResult = { areaMm2: round(area, AREA_PLACES), massPerMetreKg: round(perMetre, MASS_PLACES), massKg: round(mass, MASS_PLACES) }
  if (input.section.shape === 'hex' || input.section.shape === 'square') {
    result.acrossCornersMm = round(sectionWidthMm(input.section), AREA_PLACES)
  }
  if (input.pricePerKg !== undefined) {
    result.costPerMetre = round(perMetre * input.pricePerKg, MONEY_PLACES)
    result.cost = round(mass * input.pricePerKg, MONEY_PLACES)
  } else if (input.pricePerMetre !== undefined) {
    result.costPerMetre = round(input.pricePerMetre, MONEY_PLACES)
    result.cost = round((input.pricePerMetre * input.lengthMm) / MM_PER_M, MONEY_PLACES)
  }
  return result
}
