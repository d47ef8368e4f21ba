import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  availabilityOf, blankLength, cutsAlongPiece, drawnStock, lineNeed, outstandingOf, piecesDrawn,
  progressOf, stockPerPiece,
} from '../../../shared/domain/bom'
import { planCuts } from '../../../shared/domain/cutting'

/** Kerf 1.5 mm and facing 0.5 mm per end [common practice, reference §7]. */
const C = { kerfMm: 1.5, facingMm: 0.5 }

describe('what a BOM line takes from stores', () => {
  it('is the quantity for a counted line', () => {
    const line = { quantity: 24, pieces: 1, drawn: 4, bar: false }
    expect(lineNeed(line, C)).toBe(24)
    expect(drawnStock(line, C)).toBe(4)
    expect(outstandingOf(line, 12, C)).toBe(8)
    expect(outstandingOf(line, 30, C)).toBe(0)
  })

  it('is pieces × (length + 2 × facing + kerf) for a bar line [F: 60 + 1 + 1.5 = 62.5 mm]', () => {
    expect(stockPerPiece(60, C)).toBe(62.5)
    expect(blankLength(60, C)).toBe(61)
    const line = { quantity: 60, pieces: 3, drawn: 120, bar: true }
    expect(lineNeed(line, C)).toBe(187.5)
    expect(piecesDrawn(line)).toBe(2)
    expect(drawnStock(line, C)).toBe(125)
    expect(outstandingOf(line, 40, C)).toBe(22.5)
  })
})

describe('availability of a line', () => {
  it('is ok when nothing is outstanding, caution when free stock covers it, short otherwise', () => {
    expect(availabilityOf(0, -3)).toBe('ok')
    expect(availabilityOf(5, 5)).toBe('caution')
    expect(availabilityOf(5, 4)).toBe('short')
  })
})

describe('build progress', () => {
  it('counts lines held, drawn and short and averages the percentages line by line', () => {
    const p = progressOf([
      { need: 10, drawn: 10, reserved: 0, shortQuantity: 0 },
      { need: 4, drawn: 0, reserved: 2, shortQuantity: 2 },
      { need: 100, drawn: 0, reserved: 100, shortQuantity: 0 },
      { need: 8, drawn: 0, reserved: 0, shortQuantity: 0 },
    ])
    // reserved+drawn fractions 1, 0.5, 1, 0 → 62.5 % → 63; drawn 1, 0, 0, 0 → 25 %.
    expect(p).toEqual({ lines: 4, reservedLines: 2, drawnLines: 1, shortLines: 1, reservedPct: 63, drawnPct: 25 })
    expect(progressOf([])).toMatchObject({ lines: 0, reservedPct: 0, drawnPct: 0 })
  })
})

describe('cuts along one piece, as a draw takes them', () => {
  it('takes blank + kerf per cut and leaves L − n(l + 2f + k) [F: 500 − 2 × 62.5 = 375]', () => {
    const cuts = cutsAlongPiece(7, 500, 61, 1.5, 2)!
    expect(cuts.map((c) => [c.startMm, c.endMm, c.takeMm])).toEqual([[0, 61, 62.5], [62.5, 123.5, 62.5]])
    expect(500 - cuts.reduce((s, c) => s + c.takeMm, 0)).toBe(375)
  })

  it('loses only what is left at the end of the bar, and refuses what does not fit', () => {
    const exact = cutsAlongPiece(1, 123.5, 61, 1.5, 2)!
    expect(exact.map((c) => c.takeMm)).toEqual([62.5, 61])
    expect(cutsAlongPiece(1, 123, 61, 1.5, 2)).toBeNull()
  })

  it('puts the cuts where the cutting-list planner does, with the same offcut, on any one bar', () => {
    fc.assert(fc.property(
      fc.integer({ min: 10, max: 2000 }), fc.integer({ min: 1, max: 300 }), fc.integer({ min: 1, max: 8 }),
      fc.constantFrom(0, 1, 1.5, 3), fc.constantFrom(0, 0.5, 1),
      (bar, length, n, kerf, facing) => {
        const plan = planCuts({ stock: [{ id: '1', lengthMm: bar }], cuts: [{ label: 'p', lengthMm: length, qty: n }], kerfMm: kerf, facingMm: facing })
        const cuts = cutsAlongPiece(1, bar, length + 2 * facing, kerf, n)
        if (plan.unplaced.length) return cuts === null
        const laid = plan.plans[0]
        const left = bar - cuts!.reduce((s, c) => s + c.takeMm, 0)
        return cuts!.every((c, i) => Math.abs(c.startMm - laid.cuts[i].startMm) < 1e-6 && Math.abs(c.endMm - laid.cuts[i].endMm) < 1e-6)
          && Math.abs(left - (laid.offcutMm + laid.scrapMm)) < 1e-6
      },
    ), { seed: 5, numRuns: 300 })
  })
})
