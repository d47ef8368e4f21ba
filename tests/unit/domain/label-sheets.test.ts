import { describe, expect, it } from 'vitest'
import {
  PAPERS, SHEET_PRESETS, customSheet, findSheet, labelPlaces, labelsPerSheet, pageCount, positionOf,
  sheetProblems, type SheetGrid,
} from '../../../shared/domain/label-sheets'

const sheet = (id: string) => findSheet(id)!
const a4x24 = sheet('a4-3x8-70x37')
const letter30 = sheet('letter-3x10-66.7x25.4')

describe('label sheet presets', () => {
  it('offers A4 and US Letter sheets in at least three label sizes', () => {
    expect(new Set(SHEET_PRESETS.map((s) => s.paper))).toEqual(new Set(['A4', 'Letter']))
    const sizes = new Set(SHEET_PRESETS.map((s) => `${s.labelWidthMm}x${s.labelHeightMm}`))
    expect(sizes.size).toBeGreaterThanOrEqual(3)
  })

  it.each(SHEET_PRESETS.map((s) => [s.name, s] as const))('%s fits its paper', (_name, s) => {
    expect(sheetProblems(s)).toEqual([])
  })

  it('names sheets by paper, grid and label size only', () => {
    expect(a4x24.name).toBe('A4 · 3 × 8 · 70 × 37 mm')
    expect(letter30.name).toBe('US Letter · 3 × 10 · 66.7 × 25.4 mm')
    for (const s of SHEET_PRESETS) expect(s.name).toMatch(/^(A4|US Letter) · \d+ × \d+ · [\d.]+ × [\d.]+ mm$/)
  })

  it('lays the 2⅝ × 1 in Letter sheet edge to edge: 3/16 in + 3 labels + 2 gaps of ⅛ in + 3/16 in = 8½ in', () => {
    // Arithmetic from the inch dimensions [F]; the sheet's right margin equals its left.
    const right = letter30.marginLeftMm + 3 * letter30.labelWidthMm + 2 * letter30.gapXMm
    expect(right).toBeCloseTo(PAPERS.Letter.widthMm - letter30.marginLeftMm, 9)
    expect(letter30.marginTopMm + 10 * letter30.labelHeightMm).toBeCloseTo(279.4 - 12.7, 9)
  })
})

describe('where each label goes', () => {
  it('counts positions across each row, then down (A4 3 × 8, 70 × 37 mm)', () => {
    expect(positionOf(a4x24, 1)).toMatchObject({ column: 0, row: 0, xMm: 0, yMm: 0.5 })
    expect(positionOf(a4x24, 3)).toMatchObject({ column: 2, row: 0, xMm: 140, yMm: 0.5 })
    expect(positionOf(a4x24, 4)).toMatchObject({ column: 0, row: 1, xMm: 0, yMm: 37.5 })
    expect(positionOf(a4x24, 24)).toMatchObject({ column: 2, row: 7, xMm: 140, yMm: 259.5 })
  })

  it('adds the gaps between labels (A4 3 × 7, 63.5 × 38.1 mm with 2.54 mm gaps)', () => {
    const s = sheet('a4-3x7-63.5x38.1')
    expect(positionOf(s, 2).xMm).toBeCloseTo(7.21 + 63.5 + 2.54, 9)
    expect(positionOf(s, 21).yMm).toBeCloseTo(15.15 + 6 * 38.1, 9)
  })

  it('starts at the first free position of a partly used sheet, then fills whole pages', () => {
    const places = labelPlaces(a4x24, 30, 5)
    expect(places).toHaveLength(30)
    expect(places[0]).toMatchObject({ page: 0, position: 5, column: 1, row: 1 })
    expect(places.filter((p) => p.page === 0)).toHaveLength(20)
    expect(places[20]).toMatchObject({ page: 1, position: 1, xMm: 0, yMm: 0.5 })
    expect(places[29]).toMatchObject({ page: 1, position: 10 })
    expect(pageCount(a4x24, 30, 5)).toBe(2)
  })

  it('counts pages for the layout and the start position', () => {
    expect(pageCount(a4x24, 0)).toBe(0)
    expect(pageCount(a4x24, 24)).toBe(1)
    expect(pageCount(a4x24, 25)).toBe(2)
    expect(pageCount(a4x24, 240)).toBe(10)
    expect(pageCount(a4x24, 1, 24)).toBe(1)
    expect(pageCount(a4x24, 2, 24)).toBe(2)
    expect(pageCount(sheet('a4-5x13-38.1x21.2'), 240, 60)).toBe(Math.ceil((59 + 240) / 65))
  })

  it('agrees with pageCount for every preset and start', () => {
    for (const s of SHEET_PRESETS) {
      for (const start of [1, 2, labelsPerSheet(s)]) {
        const places = labelPlaces(s, 100, start)
        expect(places.at(-1)!.page + 1).toBe(pageCount(s, 100, start))
        expect(new Set(places.map((p) => `${p.page}/${p.position}`)).size).toBe(100)
      }
    }
  })

  it('refuses a start position that is not on the sheet', () => {
    expect(() => labelPlaces(a4x24, 1, 0)).toThrow(RangeError)
    expect(() => labelPlaces(a4x24, 1, 25)).toThrow(/1–24/)
    expect(() => labelPlaces(a4x24, 1, 2.5)).toThrow(RangeError)
  })
})

describe('custom sheets', () => {
  const grid: SheetGrid = {
    paper: 'A4', columns: 2, rows: 6, labelWidthMm: 99.1, labelHeightMm: 42.3,
    marginTopMm: 21.6, marginLeftMm: 4.65, gapXMm: 2.5, gapYMm: 0,
  }

  it('is named like the presets and placed by the same arithmetic', () => {
    const s = customSheet(grid)
    expect(s.id).toBe('custom')
    expect(s.name).toBe('A4 · 2 × 6 · 99.1 × 42.3 mm')
    expect(sheetProblems(s)).toEqual([])
    expect(positionOf(s, 4)).toMatchObject({ column: 1, row: 1 })
    expect(positionOf(s, 4).xMm).toBeCloseTo(4.65 + 99.1 + 2.5, 9)
    expect(positionOf(s, 4).yMm).toBeCloseTo(21.6 + 42.3, 9)
  })

  it('says why a grid does not fit the paper', () => {
    expect(sheetProblems({ ...grid, columns: 3 })).toEqual(['The labels reach 306.9 mm across; A4 is 210 mm wide.'])
    expect(sheetProblems({ ...grid, paper: 'Letter', rows: 7 })[0]).toMatch(/reach 317.7 mm down; US Letter is 279.4 mm tall/)
  })
})
