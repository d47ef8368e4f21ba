import { describe, expect, it } from 'vitest'
import {
  DEFAULT_DRILL_SET, clearanceDrill, defaultDrillSetNames, drillSetFromNames, engagementPercent,
  nearestDrill, parseDrill, tappingDrill, type Drill,
} from '../../../shared/domain/drills'

const drill = (text: string): Drill => {
  const p = parseDrill(text)
  if (!p.ok) throw new Error(p.message)
  return p.drill
}

/** Number drills in inches: ASME B94.11M via the toolmex size-equivalents chart [S]. */
const NUMBER: [number, number][] = [
  [1, 0.228], [2, 0.221], [3, 0.213], [7, 0.201], [9, 0.196], [10, 0.1935], [12, 0.189], [14, 0.182],
  [16, 0.177], [17, 0.173], [19, 0.166], [20, 0.161], [21, 0.159], [22, 0.157], [24, 0.152], [25, 0.1495],
  [27, 0.144], [29, 0.136], [30, 0.1285], [31, 0.12], [32, 0.116], [33, 0.113], [34, 0.111], [36, 0.1065],
  [37, 0.104], [38, 0.1015], [42, 0.0935], [43, 0.089], [44, 0.086], [45, 0.082], [46, 0.081], [47, 0.0785],
  [50, 0.07], [52, 0.0635], [53, 0.0595], [54, 0.055], [55, 0.052], [56, 0.0465], [60, 0.04], [80, 0.0135],
]
/** Letter drills in inches: ASME B94.11M via the toolmex chart [S]. */
const LETTER: [string, number][] = [
  ['A', 0.234], ['C', 0.242], ['D', 0.246], ['E', 0.25], ['F', 0.257], ['G', 0.261], ['I', 0.272], ['J', 0.277],
  ['M', 0.295], ['P', 0.323], ['Q', 0.332], ['U', 0.368], ['W', 0.386], ['Z', 0.413],
]

describe('drill sizes (ASME B94.11M number and letter gauge)', () => {
  it.each(NUMBER)('#%i is %s in (toolmex chart [S])', (n, inches) => {
    expect(drill(`#${n}`)).toMatchObject({ name: `#${n}`, kind: 'number', diameterIn: inches })
    expect(drill(`#${n}`).diameterMm).toBeCloseTo(inches * 25.4, 4)
  })
  it.each(LETTER)('letter %s is %s in (toolmex chart [S])', (l, inches) => {
    expect(drill(l)).toMatchObject({ name: l, kind: 'letter', diameterIn: inches })
  })
  it('has E = 0.250 in = 1/4 in; 1/4 in is not letter Q (Q = 0.332) as one drill page says (reference §10)', () => {
    expect(drill('E').diameterMm).toBe(drill('1/4').diameterMm)
    expect(drill('Q').diameterIn).toBe(0.332)
  })
})

describe('parseDrill', () => {
  it.each([
    ['#43', '#43'], ['43', '#43'], ['No. 43', '#43'], ['no43', '#43'], ['F', 'F'], ['f', 'F'],
    ['3.3', '3.3 mm'], ['3.3mm', '3.3 mm'], ['3.3 mm', '3.3 mm'], ['3,3 mm', '3.3 mm'], ['2.65', '2.65 mm'],
    ['10mm', '10.0 mm'], ['1/8', '1/8"'], ['1/8"', '1/8"'], ['2/16 in', '1/8"'], ['17/64', '17/64"'], ['0.125in', '0.125"'],
  ])('reads "%s" as %s', (typed, name) => {
    expect(drill(typed).name).toBe(name)
  })

  it('gives sizes in both units: 3.3 mm = 0.1299 in; 1/8 in = 3.175 mm', () => {
    expect(drill('3.3').diameterIn).toBe(0.1299)
    expect(drill('1/8').diameterMm).toBe(3.175)
  })

  it.each(['#81', '0', 'AA', '', '1/0', '-3', 'big', '200 mm'])('refuses "%s" with a message', (typed) => {
    const p = parseDrill(typed)
    expect(p.ok).toBe(false)
    if (!p.ok) expect(p.message.length).toBeGreaterThan(10)
  })
})

describe('default drill set', () => {
  it('holds metric 0.5–13 mm by 0.1, #1–#80, A–Z and 1/64–1/2 in by 1/64 (264 drills)', () => {
    const kinds = (k: string) => DEFAULT_DRILL_SET.filter((d) => d.kind === k).length
    expect([kinds('metric'), kinds('number'), kinds('letter'), kinds('fraction')]).toEqual([126, 80, 26, 32])
    expect(DEFAULT_DRILL_SET[0].name).toBe('#80')
    expect(DEFAULT_DRILL_SET.at(-1)!.name).toBe('13.0 mm')
    expect(defaultDrillSetNames()).toContain('1/2"')
  })

  it('reports names it cannot read instead of dropping them silently', () => {
    const r = drillSetFromNames(['#43', 'nonsense', '3.3 mm'])
    expect(r.drills.map((d) => d.name)).toEqual(['#43', '3.3 mm'])
    expect(r.rejected).toEqual(['nonsense'])
  })
})

describe('choosing drills', () => {
  const set = drillSetFromNames(['2.4 mm', '2.5 mm', '2.6 mm', '#40', '3.4 mm', '3.5 mm']).drills

  it('takes the nearest drill, the larger on a tie', () => {
    expect(nearestDrill(2.52, set)!.name).toBe('2.5 mm')
    expect(nearestDrill(2.55, set)!.name).toBe('2.6 mm')
  })

  it('never takes a tapping drill smaller than the minor diameter, even when it is nearer', () => {
    expect(tappingDrill(2.42, 2.459, set)!.name).toBe('#40')
  })

  it('takes the smallest drill at least as large as a clearance target [CP]', () => {
    expect(clearanceDrill(3.4, set)!.name).toBe('3.4 mm')
    expect(clearanceDrill(3.41, set)!.name).toBe('3.5 mm')
    expect(clearanceDrill(3.6, set)).toBeNull()
  })

  it('prefers drills of the thread’s own system when asked, falling back to any', () => {
    const mixed = drillSetFromNames(['6.8 mm', 'H']).drills
    expect(nearestDrill(6.75, mixed)!.name).toBe('H')
    expect(nearestDrill(6.75, mixed, 'metric')!.name).toBe('6.8 mm')
    expect(nearestDrill(6.75, drillSetFromNames(['H']).drills, 'metric')!.name).toBe('H')
  })

  it('computes engagement as (d − drill)/(d − d1) × 100 (reference §1 [CP])', () => {
    expect(engagementPercent(6.35, 5.8, 6.35 - 1.280654 * 0.635)).toBeCloseTo(67.6, 1)
    expect(engagementPercent(3, 2.5, 3 - 1.299038 * 0.5)).toBeCloseTo(77, 0)
  })
})
