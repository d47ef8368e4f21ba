/**
 * Thread data by designation, with tapping and clearance drills from the workshop's own drill set.
 * Entry point for the route, the client and the parts search; the tables live in thread-data.ts.
 */
import { MM_PER_IN } from './drill-sizes'
import {
  DEFAULT_DRILL_SET, clearanceDrill, engagementPercent, parseDrill, tappingDrill, type Drill,
} from './drills'
import { SERIES_NAME, SERIES_STANDARD, type ThreadSeries, type ThreadSpec } from './thread-data'
import {
  clearanceRule, geometryOf, preferredDrills, tapRule, type ClearanceFit, type ThreadGeometry,
} from './thread-geometry'
import { designationOf, keyOf } from './thread-names'
import { parseThread } from './thread-parse'
import { PUBLISHED_DRILLS, type PublishedDrill } from './thread-published'

export { parseThread, threadKey, type ThreadParse } from './thread-parse'
export { designationOf, keyOf } from './thread-names'
export { THREAD_CATALOGUE, type ThreadSeries, type ThreadSpec } from './thread-data'
export type { ClearanceFit } from './thread-geometry'

export interface DrillChoice {
  name: string
  diameterMm: number
  diameterIn: number
  /** Tapping drills only: percentage of full thread depth this drill leaves. */
  engagementPercent?: number
}
export interface DrillAlternative extends DrillChoice {
  source: string
  /** True when the drill is smaller than the minor diameter: the tap would jam or break. */
  belowMinor?: boolean
}
export interface DrillAdvice {
  theoreticalMm: number
  rule: string
  nearest: DrillChoice | null
  alternatives: DrillAlternative[]
}

export interface ThreadInfo {
  series: ThreadSeries
  seriesName: string
  standard: string
  designation: string
  key: string
  majorDiameterMm: number
  pitchMm: number
  /** Threads per inch: inch series and BA (25.4 / p); null for ISO metric. */
  tpi: number | null
  angleDeg: number
  pitchDiameterMm: number
  minorDiameterMm: number
  externalMinorDiameterMm?: number
  /** Inch series: the same diameters in inches. */
  inch?: { majorDiameterIn: number; pitchDiameterIn: number; minorDiameterIn: number }
  tapDrill: DrillAdvice
  clearanceDrill: DrillAdvice & { fit: ClearanceFit }
  notes: string[]
}

const round = (x: number, places: number) => Number(x.toFixed(places))
/** Millimetre results to the micrometre: finer than any drawing asks. */
const MM_PLACES = 3
/** Inch results to 0.0001 in, as the inch tables print them. */
const IN_PLACES = 4
/** BA tpi to one decimal, as the BA tables print it. */
const TPI_PLACES = 1

const choice = (d: Drill, g?: ThreadGeometry, majorMm?: number): DrillChoice => ({
  name: d.name,
  diameterMm: d.diameterMm,
  diameterIn: d.diameterIn,
  ...(g && majorMm ? { engagementPercent: engagementPercent(majorMm, d.diameterMm, g.fullThreadMinorMm) } : {}),
})

/** Published drills with sizes and engagement; one entry per drill, its sources joined. */
function alternatives(list: PublishedDrill[], t: ThreadSpec, g?: ThreadGeometry): DrillAlternative[] {
  const byName = new Map<string, DrillAlternative>()
  for (const { drill, source } of list) {
    const p = parseDrill(drill)
    if (!p.ok) continue
    const seen = byName.get(p.drill.name)
    if (seen) {
      seen.source = `${seen.source}; ${source}`
      continue
    }
    const base: DrillAlternative = { ...choice(p.drill, g, t.majorMm), source }
    byName.set(p.drill.name, g && p.drill.diameterMm < g.minorDiameterMm ? { ...base, belowMinor: true } : base)
  }
  return [...byName.values()]
}

/** Everything the workbench shows for one thread, drills chosen from `drills`. */
export function describeThread(t: ThreadSpec, drills: readonly Drill[] = DEFAULT_DRILL_SET, fit: ClearanceFit = 'medium'): ThreadInfo {
  const g = geometryOf(t)
  const prefer = preferredDrills(g.form)
  const tap = tapRule(t, g)
  const clear = clearanceRule(t, fit)
  const tapNearest = tappingDrill(tap.theoreticalMm, g.minorDiameterMm, drills, prefer)
  const clearNearest = clearanceDrill(clear.theoreticalMm, drills, prefer)
  const published = PUBLISHED_DRILLS[keyOf(t)]
  const inchSeries = t.majorIn !== undefined
  return {
    series: t.series,
    seriesName: SERIES_NAME[t.series],
    standard: SERIES_STANDARD[t.series],
    designation: designationOf(t),
    key: keyOf(t),
    majorDiameterMm: round(t.majorMm, MM_PLACES),
    pitchMm: round(t.pitchMm, MM_PLACES + 1),
    tpi: t.tpi ?? (t.series === 'BA' ? round(MM_PER_IN / t.pitchMm, TPI_PLACES) : null),
    angleDeg: g.angleDeg,
    pitchDiameterMm: round(g.pitchDiameterMm, MM_PLACES),
    minorDiameterMm: round(g.minorDiameterMm, MM_PLACES),
    ...(g.externalMinorDiameterMm === undefined ? {} : { externalMinorDiameterMm: round(g.externalMinorDiameterMm, MM_PLACES) }),
    ...(inchSeries ? { inch: inchDiameters(t, g) } : {}),
    tapDrill: {
      theoreticalMm: round(tap.theoreticalMm, MM_PLACES),
      rule: tap.rule,
      nearest: tapNearest ? choice(tapNearest, g, t.majorMm) : null,
      alternatives: alternatives(published?.tap ?? [], t, g),
    },
    clearanceDrill: {
      fit,
      theoreticalMm: round(clear.theoreticalMm, MM_PLACES),
      rule: clear.rule,
      nearest: clearNearest ? choice(clearNearest) : null,
      alternatives: alternatives(published?.clearance ?? [], t),
    },
    notes: published?.notes ?? [],
  }
}

const inchDiameters = (t: ThreadSpec, g: ThreadGeometry) => ({
  majorDiameterIn: round(t.majorMm / MM_PER_IN, IN_PLACES),
  pitchDiameterIn: round(g.pitchDiameterMm / MM_PER_IN, IN_PLACES),
  minorDiameterIn: round(g.minorDiameterMm / MM_PER_IN, IN_PLACES),
})

/** Result of looking a typed designation up: the thread, or why not and what was probably meant. */
export type ThreadLookup =
  | { ok: true; thread: ThreadInfo }
  | { ok: false; message: string; suggestions: string[] }

export function lookupThread(designation: string, drills?: readonly Drill[], fit?: ClearanceFit): ThreadLookup {
  const p = parseThread(designation)
  if (!p.ok) return p
  const info = describeThread(p.spec, drills, fit)
  return { ok: true, thread: { ...info, notes: [...p.notes, ...info.notes] } }
}
