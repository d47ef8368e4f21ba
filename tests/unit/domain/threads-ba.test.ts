import { describe, expect, it } from 'vitest'
import { baMajorMm, baPitchMm } from '../../../shared/domain/thread-data'
import { lookupThread, type ThreadInfo } from '../../../shared/domain/threads'
import { parseDrill } from '../../../shared/domain/drills'

const thread = (d: string): ThreadInfo => {
  const r = lookupThread(d)
  if (!r.ok) throw new Error(r.message)
  return r.thread
}

const drillName = (text: string) => {
  const p = parseDrill(text)
  if (!p.ok) throw new Error(p.message)
  return p.drill.name
}

/**
 * [BA, p mm, d mm, d in, tpi, source].
 * 0–10: BS 93:2008 table, "[S][F]" (checked against a published copy and the formula).
 * 11–16: BS 93:2008 table from memory (the reference table stops at 10BA); the formula check is "[F]".
 */
const BS93: [number, number, number, number, number, string][] = [
  [0, 1.0, 6.0, 0.2362, 25.4, 'BS 93:2008 table [S][F]'],
  [1, 0.9, 5.3, 0.2087, 28.2, 'BS 93:2008 table [S][F]'],
  [2, 0.81, 4.7, 0.185, 31.4, 'BS 93:2008 table [S][F]'],
  [3, 0.73, 4.1, 0.1614, 34.8, 'BS 93:2008 table [S][F]'],
  [4, 0.66, 3.6, 0.1417, 38.5, 'BS 93:2008 table [S][F]'],
  [5, 0.59, 3.2, 0.126, 43.1, 'BS 93:2008 table [S][F]'],
  [6, 0.53, 2.8, 0.1102, 47.9, 'BS 93:2008 table [S][F]'],
  [7, 0.48, 2.5, 0.0984, 52.9, 'BS 93:2008 table [S][F]'],
  [8, 0.43, 2.2, 0.0866, 59.1, 'BS 93:2008 table [S][F]'],
  [9, 0.39, 1.9, 0.0748, 65.1, 'BS 93:2008 table [S][F]'],
  [10, 0.35, 1.7, 0.0669, 72.6, 'BS 93:2008 table [S][F]'],
  [11, 0.31, 1.5, 0.0591, 81.9, 'BS 93:2008 table, from memory [M]; formula [F]'],
  [12, 0.28, 1.3, 0.0512, 90.7, 'BS 93:2008 table, from memory [M]; formula [F]'],
  [13, 0.25, 1.2, 0.0472, 101.6, 'BS 93:2008 table, from memory [M]; formula [F]'],
  [14, 0.23, 1.0, 0.0394, 110.4, 'BS 93:2008 table, from memory [M]; formula [F]'],
  [15, 0.21, 0.9, 0.0354, 121.0, 'BS 93:2008 table, from memory [M]; formula [F]'],
  [16, 0.19, 0.79, 0.0311, 133.7, 'BS 93:2008 table, from memory [M]; formula [F]'],
]

describe('BA threads (BS 93)', () => {
  describe.each(BS93)('%iBA', (n, p, d, dIn, tpi, source) => {
    it(`reproduces pitch ${p} mm and major ${d} mm from p = 0.9ⁿ, d = 6·p^1.2 at 2 s.f. (${source})`, () => {
      expect(baPitchMm(n)).toBe(p)
      expect(baMajorMm(n)).toBe(d)
    })
    it(`reports ${d} mm, ${dIn} in, ${tpi} tpi, 47.5° through the lookup (${source})`, () => {
      const t = thread(`${n}BA`)
      expect(t).toMatchObject({ series: 'BA', majorDiameterMm: d, pitchMm: p, tpi, angleDeg: 47.5 })
      expect(Number((t.majorDiameterMm / 25.4).toFixed(4))).toBe(dIn)
    })
  })

  it('gives 6BA pitch diameter 2.482 mm and minor 2.164 mm (derived from d − 0.6p, d − 1.2p [F])', () => {
    const t = thread('6BA')
    expect(t.pitchDiameterMm).toBe(2.482)
    expect(t.minorDiameterMm).toBe(2.164)
  })

  it('gives the 8BA minor diameter as 1.684 mm (reference §10 [F])', () => {
    expect(thread('8BA').minorDiameterMm).toBe(1.684)
  })

  it('takes tpi as 25.4/p from the metric pitch: 10BA is 72.6, not 72.46 from a rounded inch pitch (reference §10)', () => {
    expect(thread('10BA').tpi).toBe(72.6)
    // The inch diameter is mm/25.4 to 0.0001 in; tables vary in the last digit (0.0669/0.0670, 0.0511/0.0512).
    expect(Number((thread('10BA').majorDiameterMm / 25.4).toFixed(4))).toBe(0.0669)
  })

  it('keeps 0.81 mm as the 2BA pitch, not the 0.89 mm a forum post gives (BS 93, reference §10)', () => {
    const t = thread('2BA')
    expect(t.pitchMm).toBe(0.81)
    expect(t.notes.join(' ')).toMatch(/0\.89/)
  })
})

/** Tapping and clearance drills per BA size: A = IBLS wiki "Threads" table [S]; B = ministeam.net tables [S]. */
const BA_DRILLS: [string, string[], string[]][] = [
  ['0BA', ['#10', '5.1 mm', '#7'], ['C', '6.2 mm', 'D']],
  ['1BA', ['#17', '4.5 mm', '#16'], ['#2', '5.5 mm']],
  ['2BA', ['#24', '4.0 mm', '#22'], ['#12', '4.9 mm', '#10']],
  ['3BA', ['#29', '3.4 mm'], ['#19']], // 3.4 mm is tagged [M] from memory
  ['4BA', ['#32', '3.0 mm', '#31'], ['#27']], // 3.0 mm / #31: britishfasteners.com [S]
  ['5BA', ['#37', '2.65 mm'], ['#30']],
  ['6BA', ['#43', '2.3 mm'], ['#34']],
  ['7BA', ['#46', '2.05 mm'], ['#38']],
  ['8BA', ['#50', '1.8 mm'], ['#43']],
  ['9BA', ['#53', '1.55 mm'], ['#47']],
  ['10BA', ['#55', '1.4 mm', '#54'], ['#50']],
]

describe('BA tapping and clearance drills (workshop tables, which disagree: reference §1 and §10)', () => {
  describe.each(BA_DRILLS)('%s', (designation, taps, clears) => {
    const t = thread(designation)
    it(`keeps every published tapping drill with its source: ${taps.join(', ')} [S]`, () => {
      const names = t.tapDrill.alternatives.map((a) => a.name)
      for (const tap of taps) expect(names).toContain(drillName(tap))
      for (const a of t.tapDrill.alternatives) expect(a.source).toMatch(/IBLS|ministeam|britishfasteners|rule of 4|from memory/)
    })
    it(`keeps the published clearance drills ${clears.join(', ')}, each larger than the major diameter [S]`, () => {
      const names = t.clearanceDrill.alternatives.map((a) => a.name)
      for (const c of clears) expect(names).toContain(drillName(c))
      for (const a of t.clearanceDrill.alternatives) expect(a.diameterMm).toBeGreaterThan(t.majorDiameterMm)
    })
    it('chooses from the default drill set a drill within the published range, at 65–85 % thread [CP]', () => {
      const usable = t.tapDrill.alternatives.filter((a) => !a.belowMinor).map((a) => a.diameterMm)
      expect(t.tapDrill.nearest!.diameterMm).toBeGreaterThanOrEqual(Math.min(...usable))
      expect(t.tapDrill.nearest!.diameterMm).toBeLessThanOrEqual(Math.max(...usable))
      expect(t.tapDrill.nearest!.engagementPercent).toBeGreaterThanOrEqual(65)
      expect(t.tapDrill.nearest!.engagementPercent).toBeLessThanOrEqual(85)
      expect(t.tapDrill.nearest!.diameterMm).toBeGreaterThanOrEqual(t.minorDiameterMm)
    })
  })

  it('stores more than one tapping drill where sources disagree: 2BA #22 vs #24, 4BA #32/#31/#34, 0BA #10 vs #7 (§10)', () => {
    const names = (d: string) => thread(d).tapDrill.alternatives.map((a) => a.name)
    expect(names('2BA')).toEqual(expect.arrayContaining(['#22', '#24']))
    expect(names('4BA')).toEqual(expect.arrayContaining(['#32', '#31', '#34']))
    expect(names('0BA')).toEqual(expect.arrayContaining(['#10', '#7']))
  })

  it('flags the "rule of 4" 8BA tap #54 (1.40 mm) as smaller than the minor diameter, not usable (§10)', () => {
    const rule4 = thread('8BA').tapDrill.alternatives.find((a) => a.name === '#54')!
    expect(rule4.source).toMatch(/rule of 4/)
    expect(rule4.diameterMm).toBeCloseTo(1.397, 3)
    expect(rule4.belowMinor).toBe(true)
    expect(thread('8BA').tapDrill.alternatives.filter((a) => a.belowMinor)).toHaveLength(1)
  })

  it('shows #50 as 1.78 mm, not the 1.85 mm one handbook is said to print (§10)', () => {
    expect(thread('8BA').tapDrill.alternatives.find((a) => a.name === '#50')!.diameterMm).toBeCloseTo(1.778, 3)
  })

  it('states the engagement formula (d − drill)/(d − d1) × 100 on each published drill [CP]', () => {
    const t = thread('7BA')
    const a = t.tapDrill.alternatives.find((x) => x.name === '2.05 mm')!
    expect(a.engagementPercent).toBeCloseTo(((2.5 - 2.05) / (2.5 - 1.924)) * 100, 1)
  })
})
