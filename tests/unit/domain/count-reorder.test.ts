import { describe, expect, it } from 'vitest'
import { countByWeight } from '../../../shared/domain/count-by-weight'
import { dailyDemand, eoq, reorderPoint, safetyStock } from '../../../shared/domain/reorder'

describe('count by weight (reference §7 [CP][F])', () => {
  it('counts 1500 pieces when 50 weigh 42.5 g and the lot nets 1275 g', () => {
    const r = countByWeight({ sampleCount: 50, sampleWeightG: 42.5, totalWeightG: 1275, scaleResolutionG: 0.1 })
    expect(r).toMatchObject({ count: 1500, pieceWeightG: 0.85, warnings: [] })
    expect(r.low).toBeLessThan(1500)
    expect(r.high).toBeGreaterThan(1500)
  })

  it('widens the range by one scale step on each reading: 1496–1504 at 0.1 g', () => {
    const r = countByWeight({ sampleCount: 50, sampleWeightG: 42.5, totalWeightG: 1275, scaleResolutionG: 0.1 })
    expect([r.low, r.high]).toEqual([1496, 1504])
    expect(r.relativeError).toBeCloseTo(0.0027, 4)
  })

  it('subtracts the tare and counts its reading in the range', () => {
    const r = countByWeight({ sampleCount: 50, sampleWeightG: 42.5, totalWeightG: 1475, tareG: 200, scaleResolutionG: 0.1 })
    expect(r.count).toBe(1500)
    expect(r.netWeightG).toBe(1275)
    expect(r.low).toBeLessThanOrEqual(1496)
    expect(r.high).toBeGreaterThanOrEqual(1504)
  })

  it('has a relative error near readability/sample mass (reference §7 [CP])', () => {
    const r = countByWeight({ sampleCount: 100, sampleWeightG: 100, totalWeightG: 10_000, scaleResolutionG: 1 })
    expect(r.relativeError).toBeGreaterThanOrEqual(0.01)
    expect(r.relativeError).toBeLessThan(0.012)
  })

  it('warns about a sample under 25 pieces or under 100 × the readability [CP]', () => {
    const r = countByWeight({ sampleCount: 10, sampleWeightG: 5, totalWeightG: 500, scaleResolutionG: 0.1 })
    expect(r.warnings).toHaveLength(2)
  })
})

describe('reorder point (reference §8)', () => {
  it('gives ROP = 96 for 8000 a year over 250 days (32/day) and a 3-day lead time (Heizer & Render example [M])', () => {
    expect(dailyDemand(8000, 250)).toBe(32)
    expect(reorderPoint({ dailyDemand: 32, leadTimeDays: 3 }).reorderPoint).toBe(96)
  })

  it('gives ROP = 75 for 1200 M4 nuts a year over 240 days, 10 days lead, safety stock 25 (shop example [F])', () => {
    expect(reorderPoint({ dailyDemand: dailyDemand(1200, 240), leadTimeDays: 10, safetyStock: 25 }).reorderPoint).toBe(75)
  })

  it('rounds a fractional lead-time demand up to whole units', () => {
    expect(reorderPoint({ dailyDemand: 0.3, leadTimeDays: 10 }).reorderPoint).toBe(3)
    expect(reorderPoint({ dailyDemand: 0.35, leadTimeDays: 10 }).reorderPoint).toBe(4)
  })

  it('computes safety stock as z·σd·√L, rounded up (textbook form [M])', () => {
    expect(safetyStock(1.65, 2, 9)).toBe(10)
  })
})

describe('economic order quantity √(2DS/H) (Harris 1913 [M])', () => {
  it('gives Q* = 200, 5 orders a year and 100 ordering + holding (Heizer & Render "Sharp, Inc." [S]; costs [F])', () => {
    expect(eoq({ annualDemand: 1000, orderCost: 10, holdingCostPerUnitYear: 0.5 })).toMatchObject({
      eoq: 200, packs: 200, orderQuantity: 200, ordersPerYear: 5, annualCost: 100,
    })
  })

  it('gives Q = 300, 32 orders, 4800 a year and a 9-day cycle on 288 days (Stevenson tyre example [S]; edition [M])', () => {
    expect(eoq({ annualDemand: 9600, orderCost: 75, holdingCostPerUnitYear: 16, workingDays: 288 })).toMatchObject({
      eoq: 300, orderQuantity: 300, ordersPerYear: 32, annualCost: 4800, cycleDays: 9,
    })
  })

  it('gives 11.4 days only on a 365-day year, the slip one reproduction made (reference §10)', () => {
    expect(eoq({ annualDemand: 9600, orderCost: 75, holdingCostPerUnitYear: 16, workingDays: 365 }).cycleDays).toBe(11.41)
  })

  it('rounds up to whole packs: Q* 200 in packs of 24 → 9 packs, 216 pieces', () => {
    expect(eoq({ annualDemand: 1000, orderCost: 10, holdingCostPerUnitYear: 0.5, packSize: 24 })).toMatchObject({
      eoq: 200, packs: 9, orderQuantity: 216,
    })
  })

  it('orders at least one pack however small Q* is', () => {
    expect(eoq({ annualDemand: 1, orderCost: 1, holdingCostPerUnitYear: 100, packSize: 100 })).toMatchObject({ packs: 1, orderQuantity: 100 })
  })
})
