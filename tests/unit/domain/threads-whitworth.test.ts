import { describe, expect, it } from 'vitest'
import { lookupThread, type ThreadInfo } from '../../../shared/domain/threads'

const thread = (d: string): ThreadInfo => {
  const r = lookupThread(d)
  if (!r.ok) throw new Error(r.message)
  return r.thread
}

/** [size, BSW tpi, BSF tpi]: BS 84 via trfastenings.com, unikgauges, tradeclassicbikes [S]. */
const BS84: [string, number, number | null][] = [
  ['1/8', 40, null], ['3/16', 24, 32], ['7/32', 24, 28], ['1/4', 20, 26], ['5/16', 18, 22], ['3/8', 16, 20],
  ['7/16', 14, 18], ['1/2', 12, 16], ['5/8', 11, 14], ['3/4', 10, 12], ['7/8', 9, 11], ['1', 8, 10],
]

describe('BSW and BSF (BS 84, 55° Whitworth form)', () => {
  it.each(BS84)('%s in: BSW %i tpi, BSF %s tpi (BS 84 [S])', (size, bsw, bsf) => {
    expect(thread(`${size} BSW`)).toMatchObject({ series: 'BSW', tpi: bsw, angleDeg: 55 })
    if (bsf) expect(thread(`${size} BSF`)).toMatchObject({ series: 'BSF', tpi: bsf, angleDeg: 55 })
    else expect(lookupThread(`${size} BSF`).ok).toBe(false)
  })

  it('gives the 1/4 BSW minor diameter as 0.1860 in (D − 1.280654p; matches trfastenings.com BSW table [S][F])', () => {
    expect(thread('1/4 BSW').inch!.minorDiameterIn).toBe(0.186)
  })

  it('gives the pitch diameter as D − 0.640327p (maccmodels Whitworth form note [S][F])', () => {
    expect(thread('1/4 BSW').inch!.pitchDiameterIn).toBeCloseTo(0.25 - 0.640327 / 20, 4)
  })
})

/** Model Engineer tapping and clearance drills: ministeam.net [S]; IBLS where it differs [S]. */
const ME: [string, string[], string[], string[]][] = [
  ['1/8-40 ME', ['2.6 mm', '#38'], ['3.5 mm', '#29'], []],
  ['5/32-40 ME', ['3.3 mm', '#30'], ['4.2 mm', '#19'], ['#30']],
  ['3/16-40 ME', ['4.1 mm', '#20'], ['5.0 mm', '#9'], ['5/32"']],
  ['7/32-40 ME', ['5.0 mm', '#9'], ['5.8 mm', '#1'], ['3/16"']],
  ['1/4-40 ME', ['5.8 mm', '#1'], ['6.6 mm', 'G'], ['7/32"']],
  ['9/32-32 ME', ['6.35 mm', 'E'], ['7.5 mm', 'M'], []],
  ['5/16-32 ME', ['7.15 mm', '9/32"'], ['8.2 mm', 'P'], ['J']],
  ['3/8-32 ME', ['8.75 mm', '11/32"'], ['9.8 mm', 'W'], ['Q']],
  ['3/8-40 ME', [], [], ['11/32"']],
]

describe('Model Engineer series (Whitworth form at 32 and 40 tpi [CP]; sizes [M])', () => {
  describe.each(ME)('%s', (designation, tap, clear, ibls) => {
    const t = thread(designation)
    it('is a 55° Whitworth-form thread at constant pitch (model-engineer.co.uk forum "ME nuts and bolts" [S])', () => {
      expect(t).toMatchObject({ series: 'ME', angleDeg: 55 })
      expect(t.tpi === 32 || t.tpi === 40).toBe(true)
    })
    it('keeps the ministeam.net and IBLS tapping drills with their sources [S]', () => {
      const alts = t.tapDrill.alternatives
      for (const name of tap) expect(alts.find((a) => a.name === name)?.source).toMatch(/ministeam/)
      for (const name of ibls) expect(alts.find((a) => a.name === name)?.source).toMatch(/IBLS/)
    })
    it('keeps the ministeam.net clearance drills, all clear of the major diameter [S]', () => {
      for (const name of clear) {
        const a = t.clearanceDrill.alternatives.find((x) => x.name === name)
        expect(a?.source).toMatch(/ministeam/)
        expect(a!.diameterMm).toBeGreaterThan(t.majorDiameterMm)
      }
    })
  })

  it('gives the 1/4-40 ME minor as 0.2180 in (5.537 mm); 5.8 mm ≈ 68 % thread and 7/32 ≈ 98 % [F]', () => {
    const t = thread('1/4-40 ME')
    expect(t.inch!.minorDiameterIn).toBe(0.218)
    expect(t.minorDiameterMm).toBe(5.537)
    const pct = (name: string) => Math.round(t.tapDrill.alternatives.find((a) => a.name === name)!.engagementPercent!)
    expect(pct('5.8 mm')).toBe(68)
    expect(pct('7/32"')).toBe(98)
    expect(t.notes.join(' ')).toMatch(/disagree/)
  })

  it('stores both 3/16-40 ME tapping drills where sources disagree: 5/32 vs #20 (reference §10)', () => {
    const names = thread('3/16-40 ME').tapDrill.alternatives.map((a) => a.name)
    expect(names).toEqual(expect.arrayContaining(['5/32"', '#20']))
  })

  it('chooses a tapping drill at 65–85 % thread from the default set for every ME size [CP]', () => {
    for (const [designation] of ME) {
      const pct = thread(designation).tapDrill.nearest!.engagementPercent!
      expect(pct).toBeGreaterThanOrEqual(65)
      expect(pct).toBeLessThanOrEqual(85)
    }
  })
})
