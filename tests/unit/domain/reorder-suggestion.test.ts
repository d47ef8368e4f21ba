import { describe, expect, it } from 'vitest'
import { buildReorderSuggestion, dailyUsage, type UsageEvent } from '../../../shared/domain/reorder-suggestion'
import { orderNeed } from '../../../shared/domain/order-suggestion'

const NOW = new Date('2025-06-30T12:00:00Z')
const DAY = 86_400_000

/** `total` drawn evenly over the last `days` days, one draw a day (the ledger of a steady user). */
function steadyDraws(total: number, days: number): UsageEvent[] {
  return Array.from({ length: days }, (_, i) => ({ at: new Date(NOW.getTime() - i * DAY - 3_600_000), quantity: total / days }))
}

const base = { now: NOW, orderCost: 10, holdingCostPerUnitYear: 0.5, packSize: 1 }

describe('reorder suggestion built from draw history', () => {
  it('gives ROP 96 from 8000 drawn over 250 days with a 3-day lead time', () => {
    // Source: Heizer & Render, Operations Management, reorder-point example: d = 8000/250 = 32, L = 3 → ROP 96 (reference §8, [M]).
    const s = buildReorderSuggestion({ ...base, usage: steadyDraws(8000, 250), windowDays: 250, leadTimeDays: 3, safetyStock: 0 })
    expect(s.dailyUse).toBe(32)
    expect(s.reorderPoint).toBe(96)
    expect(s.enoughHistory).toBe(true)
  })

  it('gives ROP 75 for the shop example: 1200 M4 nuts over 240 days, 10-day lead time, safety stock 25', () => {
    // Source: reference §8 shop example, 5/day × 10 + 25 = 75 ([F], derived from the formula).
    const s = buildReorderSuggestion({ ...base, usage: steadyDraws(1200, 240), windowDays: 240, leadTimeDays: 10, safetyStock: 25 })
    expect(s.dailyUse).toBe(5)
    expect(s.reorderPoint).toBe(75)
    expect(s.steps.find((x) => x.label === 'Reorder point')?.formula).toBe('d × L + SS = 5 × 10 + 25, rounded up')
  })

  it('gives EOQ 200 from a year of 1000 drawn, S = 10, H = 0.50', () => {
    // Source: Heizer & Render, Operations Management, Ch. 12 Example 3 "Sharp, Inc." → Q* = 200 (reference §8, [S]).
    const s = buildReorderSuggestion({ ...base, usage: steadyDraws(1000, 365), windowDays: 365, leadTimeDays: 5, safetyStock: 0 })
    expect(s.annualDemand).toBe(1000)
    expect(s.eoq).toBe(200)
    expect(s).toMatchObject({ packs: 200, orderQuantity: 200 })
  })

  it('rounds EOQ 200 up to whole packs: 9 packs of 24 = 216', () => {
    // Source: Heizer & Render Example 3 Q* = 200 (reference §8, [S]); rounding up to packs is common practice.
    const s = buildReorderSuggestion({ ...base, usage: steadyDraws(1000, 365), windowDays: 365, leadTimeDays: 5, safetyStock: 0, packSize: 24 })
    expect(s).toMatchObject({ eoq: 200, packs: 9, orderQuantity: 216 })
  })

  it('gives EOQ 300 from a year of 9600 drawn, S = 75, H = 16', () => {
    // Source: Stevenson, Operations Management, tyre-distributor example: Q = 300 (reference §8, [S] inputs and Q).
    const s = buildReorderSuggestion({ ...base, usage: steadyDraws(9600, 365), windowDays: 365, leadTimeDays: 5, safetyStock: 0, orderCost: 75, holdingCostPerUnitYear: 16 })
    expect(s.eoq).toBe(300)
  })

  it('nets returns off draws and ignores movements outside the window', () => {
    // Source: common practice — use is what left the stores and did not come back.
    const usage: UsageEvent[] = [
      { at: new Date(NOW.getTime() - 2 * DAY), quantity: 30 },
      { at: new Date(NOW.getTime() - 3 * DAY), quantity: -6 },
      { at: new Date(NOW.getTime() - 40 * DAY), quantity: 500 },
    ]
    const s = buildReorderSuggestion({ ...base, usage, windowDays: 30, leadTimeDays: 6, safetyStock: 0 })
    expect(s.used).toBe(24)
    expect(s.dailyUse).toBe(0.8)
    // 0.8 × 6 = 4.8 → rounded up to 5.
    expect(s.reorderPoint).toBe(5)
  })

  it('works out safety stock as z·σd·√L when none is given', () => {
    // Source: textbook SS = z·σd·√L (reference §8, [M]); z = 1.65 for ~95 % (normal table, from memory).
    // Draw 10 every other day over 4 days: daily use [10, 0, 10, 0] (oldest first) → mean 5, σ = 5; L = 4 → 1.65 × 5 × 2 = 16.5 → 17.
    const usage = [1, 3].map((ago) => ({ at: new Date(NOW.getTime() - ago * DAY), quantity: 10 }))
    expect(dailyUsage(usage, 4, NOW)).toEqual([10, 0, 10, 0])
    const s = buildReorderSuggestion({ ...base, usage, windowDays: 4, leadTimeDays: 4 })
    expect(s).toMatchObject({ sigmaDaily: 5, safetyStock: 17, safetyStockFrom: 'computed', reorderPoint: 37 })
  })

  it('says why no order quantity can be worked out without use or without a holding cost', () => {
    const none = buildReorderSuggestion({ ...base, usage: [], windowDays: 90, leadTimeDays: 5 })
    expect(none).toMatchObject({ enoughHistory: false, eoq: null, orderQuantity: null, reorderPoint: 0 })
    expect(none.eoqProblem).toMatch(/No use/)
    const free = buildReorderSuggestion({ ...base, usage: steadyDraws(100, 90), windowDays: 90, leadTimeDays: 5, holdingCostPerUnitYear: 0 })
    expect(free.eoqProblem).toMatch(/holding cost is 0/)
  })
})

describe('order quantity for a suggestion (s, Q) in whole packs', () => {
  // Source: common practice — order Q when the position falls to s; round up to the supplier's pack.
  it('orders the reorder quantity when available stock is at the reorder point', () => {
    expect(orderNeed({ available: 40, onOrder: 0, shortage: 0, reorderPoint: 40, reorderQuantity: 100, packSize: 25 }))
      .toMatchObject({ position: 40, needed: 100, packs: 4, quantity: 100 })
  })
  it('orders enough to get back above the reorder point when Q is too small', () => {
    expect(orderNeed({ available: 2, onOrder: 0, shortage: 0, reorderPoint: 30, reorderQuantity: 10, packSize: 10 }))
      .toMatchObject({ needed: 29, packs: 3, quantity: 30 })
  })
  it('counts what is on order, and adds build shortages', () => {
    expect(orderNeed({ available: 40, onOrder: 100, shortage: 0, reorderPoint: 40, reorderQuantity: 100, packSize: 25 })).toBeNull()
    expect(orderNeed({ available: 0, onOrder: 0, shortage: 6, reorderPoint: 0, reorderQuantity: 0, packSize: 10 }))
      .toMatchObject({ position: -6, needed: 6, packs: 1, quantity: 10 })
  })
})
