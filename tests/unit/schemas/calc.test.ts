import { describe, expect, it } from 'vitest'
import {
  barQuery, countByWeightQuery, cuttingListInput, eoqQuery, reorderPointQuery, threadQuery,
} from '../../../shared/schemas/calc'

const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]))

describe('calculator schemas', () => {
  it('coerces query-string numbers and treats blanks as not given', () => {
    const r = eoqQuery.parse({ annualDemand: '1000', orderCost: ' 10 ', holdingCostPerUnitYear: '0.5', packSize: '' })
    expect(r).toEqual({ annualDemand: 1000, orderCost: 10, holdingCostPerUnitYear: 0.5, packSize: undefined, workingDays: undefined })
  })

  it('refuses negative, zero, not-a-number, infinite and absurdly large values with a message per field', () => {
    const r = reorderPointQuery.safeParse({ dailyDemand: '-1', leadTimeDays: 'Infinity', safetyStock: 'many' })
    expect(messages(r)).toEqual({
      dailyDemand: 'Daily demand must be more than 0 a day',
      leadTimeDays: 'Lead time must be a number',
      safetyStock: 'Safety stock must be a number',
    })
    expect(messages(eoqQuery.safeParse({ annualDemand: '0', orderCost: '1e12', holdingCostPerUnitYear: 'NaN' }))).toEqual({
      annualDemand: 'Annual demand must be more than 0',
      orderCost: 'Order cost must be at most 1000000000',
      holdingCostPerUnitYear: 'Holding cost per unit per year must be a number',
    })
  })

  it('allows zero where it means something: tare, kerf, facing, safety stock', () => {
    expect(reorderPointQuery.parse({ dailyDemand: 1, leadTimeDays: 1, safetyStock: 0 }).safetyStock).toBe(0)
    expect(cuttingListInput.parse({ stock: [{ id: 'a', lengthMm: 10 }], cuts: [{ label: 'x', lengthMm: 5, qty: 1 }], kerfMm: 0 }).facingMm).toBe(0)
    expect(countByWeightQuery.parse({ sampleCount: 1, sampleWeightG: 1, totalWeightG: 2, tareG: 0, scaleResolutionG: 0.1 }).tareG).toBe(0)
  })

  it('turns bar fields into a typed section and a density from the material', () => {
    expect(barQuery.parse({ section: 'hex', size: '12.7', material: 'Brass' })).toMatchObject({
      section: { shape: 'hex', acrossFlatsMm: 12.7 }, densityKgM3: 8470, lengthMm: 1000,
    })
    expect(barQuery.parse({ section: 'tube', size: '15', wall: '1', density: '8940' }).section).toEqual({ shape: 'tube', outsideMm: 15, wallMm: 1 })
  })

  it('refuses both price forms at once, and a tare heavier than the lot', () => {
    expect(messages(barQuery.safeParse({ section: 'round', size: 10, material: 'brass', pricePerKg: 1, pricePerMetre: 2 })).pricePerMetre).toMatch(/not both/)
    expect(messages(countByWeightQuery.safeParse({ sampleCount: 50, sampleWeightG: 40, totalWeightG: 100, tareG: 150, scaleResolutionG: 0.1 })).tareG).toMatch(/less than the total/)
  })

  it('defaults the clearance fit to medium and refuses other fits', () => {
    expect(threadQuery.parse({ designation: ' 7BA ' })).toEqual({ designation: '7BA', fit: 'medium' })
    expect(messages(threadQuery.safeParse({ designation: 'M3', fit: 'loose' })).fit).toBe('fit must be close or medium')
  })

  it('caps a cutting list at 2000 pieces', () => {
    const r = cuttingListInput.safeParse({ stock: [{ id: 'a', lengthMm: 10 }], cuts: [{ label: 'x', lengthMm: 5, qty: 1500 }, { label: 'y', lengthMm: 5, qty: 1500 }], kerfMm: 1 })
    expect(messages(r).cuts).toMatch(/2000 pieces/)
  })
})
