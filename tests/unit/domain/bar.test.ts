import { describe, expect, it } from 'vitest'
import { barStock, sectionAreaMm2, sectionProblem, type BarSection } from '../../../shared/domain/bar'
import { MATERIALS, findMaterial } from '../../../shared/domain/materials'

const density = (id: string) => findMaterial(id)!.densityKgM3

/** Densities used, kg/m³, with the source tag the reference gives each (§6). */
const DENSITIES: [string, number, string][] = [
  ['mild-steel', 7850, '[S: civil-engineering unit-weight pages]'],
  ['free-cutting-steel', 7850, '[M] from memory'],
  ['silver-steel', 7850, '[M] from memory'],
  ['stainless-303', 8000, '[M] from memory'],
  ['stainless-304', 8000, '[S: alloysintl 8.03; EN 10088-1 7.9 M]'],
  ['stainless-316', 8000, '[S: metalsupplies.com, 8.0]'],
  ['brass', 8470, '[S: Durbin Metals & azom datasheets]'],
  ['phosphor-bronze', 8850, '[S: Durbin Metals, John Hood]'],
  ['gunmetal', 8800, '[S: foundry datasheet 8.7; M: 8.8]'],
  ['copper', 8940, '[S: Cu-ETP mill datasheet]'],
  ['aluminium-6082', 2700, '[M]; 6xxx 2.70 [S]'],
  ['aluminium-2011', 2830, '[S: Wilsons/John Hood 2.83; BTI 2.82]'],
  ['cast-iron', 7200, "[S: foundry lexicon; M: Machinery's Handbook]"],
]

describe('materials', () => {
  it.each(DENSITIES)('%s is %i kg/m³ %s', (id, rho) => {
    const m = findMaterial(id)!
    expect(m.densityKgM3).toBe(rho)
    expect(m.source.length).toBeGreaterThan(5)
    expect(m.rangeKgM3[0]).toBeLessThanOrEqual(rho)
    expect(m.rangeKgM3[1]).toBeGreaterThanOrEqual(rho)
  })

  it('uses 8.47 g/cm³ for brass, not the "8.47 kg/m³" unit slip one datasheet prints (reference §10)', () => {
    expect(density('brass')).toBe(8470)
  })

  it('finds materials by the words people type', () => {
    expect(findMaterial('Brass')!.id).toBe('brass')
    expect(findMaterial('CZ121')!.id).toBe('brass')
    expect(findMaterial('steel')!.id).toBe('mild-steel')
    expect(findMaterial('aluminum')!.id).toBe('aluminium-6082')
    expect(findMaterial('unobtainium')).toBeUndefined()
    expect(new Set(MATERIALS.map((m) => m.id)).size).toBe(MATERIALS.length)
  })
})

describe('bar stock', () => {
  it('computes areas: round πd²/4, hex (√3/2)·AF², square a², flat b·t, tube π·t·(OD − t) [F]', () => {
    expect(sectionAreaMm2({ shape: 'round', diameterMm: 25 })).toBeCloseTo(490.87, 2)
    expect(sectionAreaMm2({ shape: 'hex', acrossFlatsMm: 12.7 })).toBeCloseTo(139.68, 2)
    expect(sectionAreaMm2({ shape: 'square', sideMm: 20 })).toBe(400)
    expect(sectionAreaMm2({ shape: 'flat', widthMm: 25, thicknessMm: 6 })).toBe(150)
    expect(sectionAreaMm2({ shape: 'tube', outsideMm: 15, wallMm: 1 })).toBeCloseTo((Math.PI / 4) * (15 ** 2 - 13 ** 2), 9)
  })

  /** Worked examples, reference §7 [F], densities from §6. */
  const EXAMPLES: [string, BarSection, string, number, number][] = [
    ['1 m of Ø25 mm round mild steel', { shape: 'round', diameterMm: 25 }, 'mild-steel', 1000, 3.853],
    ['1 m of 1/2 in A/F hex brass CZ121', { shape: 'hex', acrossFlatsMm: 12.7 }, 'brass', 1000, 1.183],
    ['2 m of 20 mm square 6082 aluminium', { shape: 'square', sideMm: 20 }, 'aluminium-6082', 2000, 2.16],
    ['1 m of 25 × 6 mm flat mild steel', { shape: 'flat', widthMm: 25, thicknessMm: 6 }, 'mild-steel', 1000, 1.178],
    ['1 m of 15 mm OD × 1.0 mm wall C101 copper tube', { shape: 'tube', outsideMm: 15, wallMm: 1 }, 'copper', 1000, 0.393],
  ]
  it.each(EXAMPLES)('%s weighs %s… %s kg (worked example [F])', (_, section, material, lengthMm, kg) => {
    expect(barStock({ section, densityKgM3: density(material), lengthMm }).massKg).toBeCloseTo(kg, 3)
  })

  it('gives 25 mm steel round as 3.853 kg/m, near the d²/162 rule (3.858) [S], not the 1.388 one page lists (§10)', () => {
    const r = barStock({ section: { shape: 'round', diameterMm: 25 }, densityKgM3: 7850, lengthMm: 1000 })
    expect(r.massPerMetreKg).toBeCloseTo(3.853, 3)
    expect(Math.abs(r.massPerMetreKg - 25 ** 2 / 162)).toBeLessThan(0.01)
  })

  it('costs example 1 at an illustrative 1.80 per kg as 6.94 (test input only, price not sourced)', () => {
    const r = barStock({ section: { shape: 'round', diameterMm: 25 }, densityKgM3: 7850, lengthMm: 1000, pricePerKg: 1.8 })
    expect(r).toMatchObject({ costPerMetre: 6.94, cost: 6.94 })
  })

  it('costs by length: a 300 mm piece at 12.00 per metre is 3.60', () => {
    const r = barStock({ section: { shape: 'round', diameterMm: 10 }, densityKgM3: 7850, lengthMm: 300, pricePerMetre: 12 })
    expect(r).toMatchObject({ costPerMetre: 12, cost: 3.6 })
  })

  it('gives a hexagon across corners = 1.1547 × AF (reference §7)', () => {
    const r = barStock({ section: { shape: 'hex', acrossFlatsMm: 10 }, densityKgM3: 8470, lengthMm: 100 })
    expect(r.acrossCornersMm).toBeCloseTo(11.547, 2)
  })

  it('refuses a tube whose wall is half its diameter or more', () => {
    expect(sectionProblem({ shape: 'tube', outsideMm: 10, wallMm: 5 })).toMatch(/wall/)
    expect(sectionProblem({ shape: 'tube', outsideMm: 10, wallMm: 1 })).toBeNull()
  })
})
