/**
 * The reorder suggestion a part page shows: use over a chosen window of the ledger gives the
 * daily use, then W's reorder.ts gives ROP = d × L + SS and Q* = √(2DS/H) in whole packs.
 * Every figure comes with the step that produced it, so the storekeeper can check it.
 */
import { eoq, reorderPoint, safetyStock as textbookSafetyStock } from './reorder'
import type { ReorderSuggestionDto, SuggestionStep } from '../types/supplier'

/** History windows are calendar days, so a year of use is 365 of them. */
export const DAYS_PER_YEAR = 365
/** z for about 95 % of lead times covered (one-sided normal table; textbook, from memory). */
export const DEFAULT_SERVICE_Z = 1.65
/** Holding cost a year as a share of the unit cost: textbooks quote 20–30 % (common practice). */
export const DEFAULT_HOLDING_RATE = 0.25
/** Cost of placing one order — a storekeeper's hour and the postage; a guess to be overridden. */
export const DEFAULT_ORDER_COST = 5
/** Lead time assumed when the part has no supplier yet (a week's post). */
export const DEFAULT_LEAD_TIME_DAYS = 7
const MS_PER_DAY = 86_400_000

export interface UsageEvent {
  at: Date | string
  /** Positive for a draw, negative for a return. */
  quantity: number
}

export interface SuggestionInput {
  usage: UsageEvent[]
  windowDays: number
  now: Date
  leadTimeDays: number
  leadTimeFrom?: ReorderSuggestionDto['leadTimeFrom']
  /** Given: used as is; absent: z·σd·√L from the window's daily use. */
  safetyStock?: number
  orderCost: number
  holdingCostPerUnitYear: number
  packSize: number
}

const round = (x: number, places = 2) => Number(x.toFixed(places))

/** Net use on each day of the window (oldest first), days with no draws counting as 0. */
export function dailyUsage(usage: UsageEvent[], windowDays: number, now: Date): number[] {
  const days = new Array<number>(windowDays).fill(0)
  const end = now.getTime()
  for (const u of usage) {
    const age = Math.floor((end - new Date(u.at).getTime()) / MS_PER_DAY)
    if (age >= 0 && age < windowDays) days[windowDays - 1 - age] += u.quantity
  }
  return days
}

/** Population standard deviation of the daily use. */
function stdDev(xs: number[]) {
  const mean = xs.reduce((a, b) => a + b, 0) / xs.length
  return Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / xs.length)
}

export function buildReorderSuggestion(input: SuggestionInput): ReorderSuggestionDto {
  const { windowDays, leadTimeDays, orderCost: S, holdingCostPerUnitYear: H, packSize } = input
  const days = dailyUsage(input.usage, windowDays, input.now)
  const used = Math.max(0, days.reduce((a, b) => a + b, 0))
  const drawCount = input.usage.filter((u) => u.quantity > 0).length
  const d = used / windowDays
  const sigma = stdDev(days)
  const safetyFrom = input.safetyStock === undefined ? 'computed' : 'given'
  // Math.max(0, …) also turns the −0 of rounding nothing up into a plain 0.
  const ss = Math.max(0, input.safetyStock ?? textbookSafetyStock(DEFAULT_SERVICE_Z, sigma, leadTimeDays))
  const rop = { ...reorderPoint({ dailyDemand: d, leadTimeDays, safetyStock: ss }) }
  rop.reorderPoint = Math.max(0, rop.reorderPoint)
  const D = d * DAYS_PER_YEAR
  const eoqProblem = used <= 0 ? 'No use in the window, so there is no yearly demand to order for.'
    : !(H > 0) ? 'The holding cost is 0: set the part\'s unit cost (or a holding rate) first.'
      : null
  const q = eoqProblem ? null : eoq({ annualDemand: D, orderCost: S, holdingCostPerUnitYear: H, packSize })

  const steps: SuggestionStep[] = [
    { label: 'Use in the window', formula: `draws − returns over ${windowDays} days`, value: round(used, 3) },
    { label: 'Average daily use d', formula: `${round(used, 3)} ÷ ${windowDays}`, value: round(d, 3), unit: 'a day' },
    { label: 'Lead time L', formula: leadTimeText(input.leadTimeFrom), value: leadTimeDays, unit: 'days' },
    safetyFrom === 'given'
      ? { label: 'Safety stock SS', formula: 'as given', value: ss }
      : { label: 'Safety stock SS', formula: `z × σd × √L = ${DEFAULT_SERVICE_Z} × ${round(sigma, 3)} × √${leadTimeDays}, rounded up`, value: ss },
    { label: 'Reorder point', formula: `d × L + SS = ${round(d, 3)} × ${leadTimeDays} + ${ss}, rounded up`, value: rop.reorderPoint },
    { label: 'Yearly demand D', formula: `d × ${DAYS_PER_YEAR}`, value: round(D, 1) },
    { label: 'Economic order quantity Q*', formula: `√(2DS/H) = √(2 × ${round(D, 1)} × ${S} ÷ ${round(H, 4)})`, value: q ? round(q.eoq, 1) : null },
    { label: 'Order in whole packs', formula: q ? `${q.packs} pack(s) of ${packSize}` : 'not worked out', value: q ? q.orderQuantity : null },
  ]
  return {
    windowDays, used: round(used, 3), drawCount, dailyUse: round(d, 4), sigmaDaily: round(sigma, 4),
    leadTimeDays, leadTimeFrom: input.leadTimeFrom ?? 'given', safetyStock: ss, safetyStockFrom: safetyFrom,
    reorderPoint: rop.reorderPoint, annualDemand: round(D, 2), orderCost: S, holdingCostPerUnitYear: round(H, 6),
    packSize, eoq: q ? q.eoq : null, packs: q ? q.packs : null, orderQuantity: q ? q.orderQuantity : null,
    eoqProblem, steps, enoughHistory: drawCount > 0,
  }
}

function leadTimeText(from: SuggestionInput['leadTimeFrom']) {
  if (from === 'supplier') return "the preferred supplier's lead time"
  if (from === 'default') return `no supplier yet: assumed ${DEFAULT_LEAD_TIME_DAYS} days`
  return 'as given'
}
