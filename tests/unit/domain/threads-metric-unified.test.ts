import { describe, expect, it } from 'vitest'
import { lookupThread, type ThreadInfo } from '../../../shared/domain/threads'
import { ISO_273 } from '../../../shared/domain/thread-geometry'

const thread = (d: string, fit?: 'close' | 'medium'): ThreadInfo => {
  const r = lookupThread(d, undefined, fit)
  if (!r.ok) throw new Error(r.message)
  return r.thread
}

/**
 * [designation, P, d2, d3, tap drill published, theoretical d − P].
 * Pitches: ISO 261 [S] (monsterbolts, industrialcalc, mlc.org.uk); d2/d3 from the ISO 68-1 formulas [F];
 * tap drills: mlc.org.uk ISO 261/724 chart [S].
 */
const ISO: [string, number, number, number, string, number][] = [
  ['M2', 0.4, 1.74, 1.509, '1.6 mm', 1.6],
  ['M3', 0.5, 2.675, 2.387, '2.5 mm', 2.5],
  ['M4', 0.7, 3.545, 3.141, '3.3 mm', 3.3],
  ['M5', 0.8, 4.48, 4.019, '4.2 mm', 4.2],
  ['M6', 1.0, 5.35, 4.773, '5.0 mm', 5.0],
  ['M8', 1.25, 7.188, 6.466, '6.8 mm', 6.75],
  ['M10', 1.5, 9.026, 8.16, '8.5 mm', 8.5],
  ['M12', 1.75, 10.863, 9.853, '10.2 mm', 10.25],
  ['M8x1', 1.0, 7.35, 6.773, '7.0 mm', 7.0],
  ['M10x1.25', 1.25, 9.188, 8.466, '8.8 mm', 8.75],
  ['M12x1.5', 1.5, 11.026, 10.16, '10.5 mm', 10.5],
]

describe('ISO metric threads (ISO 261 pitches, ISO 724 / ISO 68-1 dimensions)', () => {
  describe.each(ISO)('%s', (designation, p, d2, d3, tap, theory) => {
    const t = thread(designation)
    it(`has pitch ${p} mm, 60° (ISO 261 [S])`, () => {
      expect(t.pitchMm).toBe(p)
      expect(t.angleDeg).toBe(60)
      expect(t.tpi).toBeNull()
    })
    it(`has d2 ${d2} and d3 ${d3} mm (ISO 68-1 formulas [F])`, () => {
      expect(t.pitchDiameterMm).toBeCloseTo(d2, 3)
      expect(t.externalMinorDiameterMm).toBeCloseTo(d3, 3)
    })
    it(`gives tap drill d − P = ${theory} mm, published ${tap} (mlc.org.uk chart [S])`, () => {
      expect(t.tapDrill.theoreticalMm).toBeCloseTo(theory, 6)
      expect(t.tapDrill.alternatives.map((a) => a.name)).toContain(tap)
      // Where d − P falls halfway between two 0.1 mm drills the larger is chosen (6.75 → 6.8, 10.25 → 10.3).
      expect(Math.abs(t.tapDrill.nearest!.diameterMm - theory)).toBeLessThanOrEqual(0.05 + 1e-9)
      expect(t.tapDrill.nearest!.name).toMatch(/mm$/)
      expect(t.tapDrill.nearest!.diameterMm).toBeGreaterThanOrEqual(t.minorDiameterMm)
    })
  })

  it('gives the M6 core (d3) as 4.77 mm, as barumite.co.uk lists it [S]', () => {
    expect(thread('M6').externalMinorDiameterMm).toBeCloseTo(4.77, 2)
  })

  it('reads about 77 % thread for a d − P drill (reference §2 [S])', () => {
    expect(thread('M3').tapDrill.nearest!.engagementPercent).toBeCloseTo(77, 0)
  })

  /** ISO 273 fine / medium / coarse clearance holes, reference §2 [M] from memory. */
  const ISO_273_REF: [string, number, number, number][] = [
    ['M3', 3.2, 3.4, 3.6], ['M4', 4.3, 4.5, 4.8], ['M5', 5.3, 5.5, 5.8],
    ['M6', 6.4, 6.6, 7.0], ['M8', 8.4, 9, 10], ['M10', 10.5, 11, 12],
  ]
  it.each(ISO_273_REF)('uses ISO 273 for %s clearance: fine %s, medium %s, coarse %s mm (from memory [M])', (d, fine, medium, coarse) => {
    expect(ISO_273[Number(d.slice(1))]).toEqual([fine, medium, coarse])
    expect(thread(d, 'close').clearanceDrill.theoreticalMm).toBe(fine)
    expect(thread(d, 'medium').clearanceDrill).toMatchObject({ theoreticalMm: medium, fit: 'medium' })
    expect(thread(d).clearanceDrill.nearest!.diameterMm).toBeCloseTo(medium, 6)
  })
})

/** [size, major in, UNC tpi, UNF tpi]: ASME B1.1 via threadchart.net, engineeringtoolbox, monsterbolts [S]. */
const UN: [string, number, number | null, number][] = [
  ['#0', 0.06, null, 80], ['#1', 0.073, 64, 72], ['#2', 0.086, 56, 64], ['#3', 0.099, 48, 56],
  ['#4', 0.112, 40, 48], ['#5', 0.125, 40, 44], ['#6', 0.138, 32, 40], ['#8', 0.164, 32, 36],
  ['#10', 0.19, 24, 32], ['#12', 0.216, 24, 28], ['1/4', 0.25, 20, 28], ['5/16', 0.3125, 18, 24],
  ['3/8', 0.375, 16, 24], ['7/16', 0.4375, 14, 20], ['1/2', 0.5, 13, 20], ['9/16', 0.5625, 12, 18],
  ['5/8', 0.625, 11, 18], ['3/4', 0.75, 10, 16], ['7/8', 0.875, 9, 14], ['1', 1.0, 8, 12],
]

describe('Unified inch threads (ASME B1.1)', () => {
  it.each(UN)('%s: major %s in, UNC %s tpi, UNF %s tpi (ASME B1.1 tables [S])', (size, major, unc, unf) => {
    const f = thread(`${size} UNF`)
    expect(f).toMatchObject({ series: 'UNF', tpi: unf, angleDeg: 60 })
    expect(f.inch!.majorDiameterIn).toBe(major)
    if (unc) expect(thread(`${size} UNC`)).toMatchObject({ series: 'UNC', tpi: unc })
    else expect(lookupThread(`${size} UNC`).ok).toBe(false)
  })

  it.each([0, 1, 2, 3, 4, 5, 6, 8, 10, 12])('numbered size #%i has major 0.060 + 0.013·N in (IBLS wiki quoting H.J. Coventry 1954 [S][F])', (n) => {
    expect(thread(`#${n} UNF`).inch!.majorDiameterIn).toBeCloseTo(0.06 + 0.013 * n, 4)
  })

  it('gives 1/4-28 UNF pitch diameter 0.2268 in and minor 0.2113 in ([F], matches threadchart.net [S])', () => {
    const t = thread('1/4-28 UNF')
    expect(t.inch).toMatchObject({ pitchDiameterIn: 0.2268, minorDiameterIn: 0.2113 })
  })

  it('gives 6-32 major as 0.138 in, not the 0.136 one supplier chart prints (reference §10)', () => {
    expect(thread('6-32').inch!.majorDiameterIn).toBe(0.138)
  })

  it('knows 1 in UNF as 1-12 (ASME B1.1) and refuses 1-14 UNF, which is the UNS series (reference §10)', () => {
    expect(thread('1" UNF').tpi).toBe(12)
    const r = lookupThread('1-14 UNF')
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.suggestions).toContain('1-12 UNF')
  })

  /** 75 % tap drills: Machinery's Handbook 31st ed. Table 2 "Tap Drill Sizes…" [S]. */
  const MH: [string, string][] = [
    ['4-40', '#43'], ['6-32', '#36'], ['8-32', '#29'], ['10-24', '#25'], ['10-32', '#21'], ['12-24', '#16'],
    ['12-28', '#14'], ['1/4-20', '#7'], ['1/4-28', '#3'], ['5/16-18', 'F'], ['3/8-16', '5/16"'], ['3/8-24', 'Q'],
    ['7/16-14', 'U'], ['7/16-20', '25/64"'], ['1/2-13', '27/64"'], ['1/2-20', '29/64"'],
  ]
  it.each(MH)("chooses the Machinery's Handbook 31st ed. 75 %% tap drill for %s: %s [S]", (d, drill) => {
    const t = thread(d)
    expect(t.tapDrill.nearest!.name).toBe(drill)
    expect(t.tapDrill.alternatives[0]).toMatchObject({ name: drill, source: expect.stringMatching(/Machinery's Handbook 31st ed/) })
  })

  it('keeps both charted tap drills where they disagree: 6-32 #36 vs #35, 5/16-24 I vs 17/64 (reference §10)', () => {
    expect(thread('6-32').tapDrill.alternatives.map((a) => a.name)).toEqual(['#36', '#35'])
    expect(thread('5/16-24').tapDrill.alternatives.map((a) => a.name)).toEqual(['I', '17/64"'])
  })
})
