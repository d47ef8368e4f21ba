import { LETTER_DRILL_IN, MM_PER_IN, NUMBER_DRILL_IN } from './drill-sizes'

export type DrillKind = 'metric' | 'number' | 'letter' | 'fraction'

/** One twist drill. `name` is the canonical spelling: `3.3 mm`, `#43`, `F`, `1/8"`. */
export interface Drill {
  name: string
  kind: DrillKind
  diameterMm: number
  diameterIn: number
}

export type DrillParse = { ok: true; drill: Drill } | { ok: false; message: string }

/** Below this two sizes count as equal: far finer than any drill chart (mm). */
const SAME_SIZE_MM = 1e-6
/** Largest drill the parser accepts: beyond it the "drill" is a boring job (mm). */
const MAX_DRILL_MM = 100
/** Largest fraction denominator written on inch drills (1/64 steps; 1/128 for safety). */
const MAX_DENOMINATOR = 128

const round = (x: number, places: number) => Number(x.toFixed(places))
const mm = (inches: number) => round(inches * MM_PER_IN, 4)
const inch = (millimetres: number) => round(millimetres / MM_PER_IN, 4)

/** `3 → "3.0 mm"`, `2.65 → "2.65 mm"`: the way metric drills are marked. */
export const metricDrillName = (d: number) => `${d.toFixed(Math.max(1, decimals(d)))} mm`
const decimals = (x: number) => (String(round(x, 3)).split('.')[1] ?? '').length

export const metricDrill = (d: number): Drill => ({
  name: metricDrillName(d), kind: 'metric', diameterMm: round(d, 3), diameterIn: inch(d),
})
export const numberDrill = (n: number): Drill => {
  const inches = NUMBER_DRILL_IN[n - 1]
  return { name: `#${n}`, kind: 'number', diameterMm: mm(inches), diameterIn: inches }
}
export const letterDrill = (l: string): Drill => {
  const inches = LETTER_DRILL_IN[l]
  return { name: l, kind: 'letter', diameterMm: mm(inches), diameterIn: inches }
}
export const fractionDrill = (num: number, den: number): Drill => {
  const g = gcd(num, den)
  const inches = num / den
  return { name: `${num / g}/${den / g}"`, kind: 'fraction', diameterMm: mm(inches), diameterIn: round(inches, 4) }
}
const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b))

const NUMBER_RE = /^(?:#|no\.?\s*)(\d{1,3})$|^(\d{1,3})$/i
const METRIC_RE = /^(\d+(?:\.\d+)?|\.\d+)\s*mm$|^(\d*\.\d+)$/i
const FRACTION_RE = /^(\d+)\s*\/\s*(\d+)\s*(?:"|''|in|inch)?$/i
const DECIMAL_INCH_RE = /^(\d*\.?\d+)\s*(?:"|''|in|inch)$/i

/**
 * Reads a drill as people write it: `#43`, `No. 43`, `43` (a bare whole number 1–80 is a number
 * drill), `F`, `3.3`, `3.3mm`, `3.3 mm`, `1/8`, `1/8"`, `0.125in`. Commas count as decimal points.
 */
export function parseDrill(input: string): DrillParse {
  const text = input.trim().replace(/,/g, '.').replace(/[″”]/g, '"')
  if (!text) return { ok: false, message: 'Give a drill: #43, F, 3.3 mm or 1/8".' }
  const n = NUMBER_RE.exec(text)
  if (n) {
    const num = Number(n[1] ?? n[2])
    if (num >= 1 && num <= NUMBER_DRILL_IN.length) return { ok: true, drill: numberDrill(num) }
    return { ok: false, message: `Number drills run from #1 to #80; "${input}" is not one. For millimetres write "${num} mm".` }
  }
  if (/^[a-z]$/i.test(text)) return { ok: true, drill: letterDrill(text.toUpperCase()) }
  const m = METRIC_RE.exec(text)
  if (m) return sized(metricDrill(Number(m[1] ?? m[2])), input)
  const f = FRACTION_RE.exec(text)
  if (f) {
    const [num, den] = [Number(f[1]), Number(f[2])]
    if (den < 1 || den > MAX_DENOMINATOR || num < 1) {
      return { ok: false, message: `"${input}" is not a drill fraction; write e.g. 1/8 or 17/64.` }
    }
    return sized(fractionDrill(num, den), input)
  }
  const d = DECIMAL_INCH_RE.exec(text)
  if (d) return sized(decimalInchDrill(Number(d[1])), input)
  return { ok: false, message: `"${input}" is not a drill size. Write #43, 43, F, 3.3, 3.3 mm or 1/8.` }
}

const decimalInchDrill = (inches: number): Drill => ({
  name: `${inches}"`, kind: 'fraction', diameterMm: mm(inches), diameterIn: round(inches, 4),
})

function sized(drill: Drill, input: string): DrillParse {
  if (drill.diameterMm > 0 && drill.diameterMm <= MAX_DRILL_MM) return { ok: true, drill }
  return { ok: false, message: `"${input}" is outside 0–${MAX_DRILL_MM} mm.` }
}

/** Metric drills in the default set: 0.5–13.0 mm in 0.1 mm steps (a common jobber set, ISO 235 sizes). */
const METRIC_SET = { fromMm: 0.5, toMm: 13, stepMm: 0.1 }
/** Fractional drills in the default set: 1/64 in steps up to 1/2 in (the usual 29-piece set and more). */
const FRACTION_SET = { denominator: 64, maxNumerator: 32 }

/** Names of the drills a workshop is assumed to own until its admin says otherwise. */
export function defaultDrillSetNames(): string[] {
  const steps = Math.round((METRIC_SET.toMm - METRIC_SET.fromMm) / METRIC_SET.stepMm)
  const metric = Array.from({ length: steps + 1 }, (_, i) =>
    metricDrillName(round(METRIC_SET.fromMm + i * METRIC_SET.stepMm, 1)))
  const numbers = NUMBER_DRILL_IN.map((_, i) => `#${i + 1}`)
  const letters = Object.keys(LETTER_DRILL_IN)
  const fractions = Array.from({ length: FRACTION_SET.maxNumerator }, (_, i) =>
    fractionDrill(i + 1, FRACTION_SET.denominator).name)
  return [...metric, ...numbers, ...letters, ...fractions]
}

/** Turns a list of drill names into drills, sorted by size; unreadable names are reported, not dropped silently. */
export function drillSetFromNames(names: readonly string[]): { drills: Drill[]; rejected: string[] } {
  const drills: Drill[] = []
  const rejected: string[] = []
  for (const name of names) {
    const p = parseDrill(name)
    if (p.ok) drills.push(p.drill)
    else rejected.push(name)
  }
  drills.sort((a, b) => a.diameterMm - b.diameterMm)
  return { drills, rejected }
}

export const DEFAULT_DRILL_SET: readonly Drill[] = drillSetFromNames(defaultDrillSetNames()).drills

/** Metric threads are best served by metric drills, inch threads by inch ones. */
export type DrillSystem = 'metric' | 'inch'
export const drillSystem = (d: Drill): DrillSystem => (d.kind === 'metric' ? 'metric' : 'inch')

/** Drills of the preferred system when any qualify, otherwise every qualifying drill. */
function preferred(candidates: readonly Drill[], prefer?: DrillSystem): readonly Drill[] {
  if (!prefer) return candidates
  const own = candidates.filter((d) => drillSystem(d) === prefer)
  return own.length ? own : candidates
}

/** The drill closest to the target; on a tie the larger one (kinder to taps). */
export function nearestDrill(targetMm: number, drills: readonly Drill[], prefer?: DrillSystem): Drill | null {
  let best: Drill | null = null
  for (const d of preferred(drills, prefer)) {
    const diff = Math.abs(d.diameterMm - targetMm)
    const bestDiff = best ? Math.abs(best.diameterMm - targetMm) : Infinity
    if (diff < bestDiff - SAME_SIZE_MM || (Math.abs(diff - bestDiff) <= SAME_SIZE_MM && best && d.diameterMm > best.diameterMm)) {
      best = d
    }
  }
  return best
}

/** Tapping: the owned drill nearest the target that is never smaller than the thread's minor diameter. */
export function tappingDrill(targetMm: number, minorMm: number, drills: readonly Drill[], prefer?: DrillSystem) {
  const usable = drills.filter((d) => d.diameterMm >= minorMm - SAME_SIZE_MM)
  return nearestDrill(targetMm, preferred(usable, prefer))
}

/** Clearance: the smallest owned drill at least as large as the target [common practice]. */
export function clearanceDrill(targetMm: number, drills: readonly Drill[], prefer?: DrillSystem): Drill | null {
  const big = preferred(drills.filter((d) => d.diameterMm >= targetMm - SAME_SIZE_MM), prefer)
  return big.reduce<Drill | null>((best, d) => (!best || d.diameterMm < best.diameterMm ? d : best), null)
}

/**
 * Percentage of full thread depth a tapping drill leaves: (d − drill) / (d − d1) × 100, where d1 is the
 * minor diameter at full depth for the thread form. Aim for 65–80 % in steel, up to ~85 % in brass [CP].
 */
export const engagementPercent = (majorMm: number, drillMm: number, fullDepthMinorMm: number) =>
  round(((majorMm - drillMm) / (majorMm - fullDepthMinorMm)) * 100, 1)
