/**
 * Reorder point and economic order quantity. Results are suggestions for a person to accept;
 * nothing here changes a part's settings.
 */

/** Floating-point slack so that 96.00000000001 still rounds up to 96, not 97. */
const EPSILON = 1e-9
const ceil = (x: number) => Math.ceil(x - EPSILON)
const round = (x: number, places: number) => Number(x.toFixed(places))

export interface ReorderPointInput {
  dailyDemand: number
  leadTimeDays: number
  safetyStock?: number
}

/** ROP = d × L + SS, rounded up to whole units (textbook form, e.g. Heizer & Render). */
export function reorderPoint({ dailyDemand, leadTimeDays, safetyStock = 0 }: ReorderPointInput) {
  const leadTimeDemand = dailyDemand * leadTimeDays
  return { reorderPoint: ceil(leadTimeDemand + safetyStock), leadTimeDemand: round(leadTimeDemand, 4) }
}

/** Average daily demand from a year's usage over the workshop's working days. */
export const dailyDemand = (annualDemand: number, workingDays: number) => annualDemand / workingDays

/** Safety stock z·σd·√L: z for the service level, σd the daily demand's standard deviation (textbook form, from memory). */
export const safetyStock = (z: number, sigmaDaily: number, leadTimeDays: number) =>
  ceil(z * sigmaDaily * Math.sqrt(leadTimeDays))

export interface EoqInput {
  annualDemand: number
  /** Cost of placing one order (S). */
  orderCost: number
  /** Cost of holding one unit for a year (H). */
  holdingCostPerUnitYear: number
  /** Supplier's pack size; the order is rounded up to whole packs. */
  packSize?: number
  /** Working days a year, for the order cycle; 0 or absent leaves the cycle out. */
  workingDays?: number
}

export interface EoqResult {
  /** Q* = √(2DS/H), unrounded. */
  eoq: number
  /** Whole packs to order: Q* ÷ pack size rounded up, at least one. */
  packs: number
  orderQuantity: number
  ordersPerYear: number
  /** Ordering + holding cost a year at the rounded order quantity: (D/Q)S + (Q/2)H. */
  annualCost: number
  cycleDays?: number
}

/** Economic order quantity, F. W. Harris (1913): Q* = √(2DS/H), then rounded up to whole packs. */
export function eoq(input: EoqInput): EoqResult {
  const { annualDemand: D, orderCost: S, holdingCostPerUnitYear: H, packSize = 1 } = input
  const q = Math.sqrt((2 * D * S) / H)
  const packs = Math.max(1, ceil(q / packSize))
  const orderQuantity = packs * packSize
  const ordersPerYear = D / orderQuantity
  const result: EoqResult = {
    eoq: round(q, 4),
    packs,
    orderQuantity,
    ordersPerYear: round(ordersPerYear, 4),
    annualCost: round(ordersPerYear * S + (orderQuantity / 2) * H, 2),
  }
  if (input.workingDays) result.cycleDays = round(input.workingDays / ordersPerYear, 2)
  return result
}
