/**
 * Sizes and pitches of the thread series the workshop meets, each table with its standard.
 * Derived dimensions (pitch and minor diameters) are computed in thread-geometry.ts.
 */
import { MM_PER_IN } from './drill-sizes'

export type ThreadSeries = 'BA' | 'M' | 'MF' | 'UNC' | 'UNF' | 'ME' | 'BSW' | 'BSF'
export type ThreadForm = 'BA' | 'ISO' | 'UN' | 'Whitworth'

/** One thread size in one series: the facts every other value is derived from. */
export interface ThreadSpec {
  series: ThreadSeries
  /** Size as written in the designation: `7` (BA), `2.5` (metric), `1/4`, `#10`, `1` (inch). */
  size: string
  majorMm: number
  pitchMm: number
  /** Inch series only: the exact inch major diameter and threads per inch. */
  majorIn?: number
  tpi?: number
}

export const SERIES_FORM: Record<ThreadSeries, ThreadForm> = {
  BA: 'BA', M: 'ISO', MF: 'ISO', UNC: 'UN', UNF: 'UN', ME: 'Whitworth', BSW: 'Whitworth', BSF: 'Whitworth',
}

export const SERIES_NAME: Record<ThreadSeries, string> = {
  BA: 'British Association', M: 'ISO metric coarse', MF: 'ISO metric fine',
  UNC: 'Unified coarse', UNF: 'Unified fine', ME: 'Model Engineer',
  BSW: 'British Standard Whitworth', BSF: 'British Standard Fine',
}

export const SERIES_STANDARD: Record<ThreadSeries, string> = {
  BA: 'BS 93:2008', M: 'ISO 261 / ISO 724', MF: 'ISO 261 / ISO 724', UNC: 'ASME B1.1', UNF: 'ASME B1.1',
  ME: 'Whitworth form (BS 84) at constant pitch; common practice', BSW: 'BS 84', BSF: 'BS 84',
}

// ---------- BA (BS 93) ----------

/** BS 93: pitch of n BA is 0.9ⁿ mm. */
export const BA_PITCH_RATIO = 0.9
/** BS 93: major diameter d = 6·p^1.2 mm. */
export const BA_DIAMETER_FACTOR = 6
export const BA_DIAMETER_EXPONENT = 1.2
/** BS 93 tabulates pitch and diameter to 2 significant figures (mm). */
export const BA_SIGNIFICANT_FIGURES = 2
/** BS 93:2008 covers 0 BA to 16 BA. */
export const BA_MAX = 16

export const roundSignificant = (x: number, figures: number) => Number(x.toPrecision(figures))

export const baPitchMm = (n: number) => roundSignificant(BA_PITCH_RATIO ** n, BA_SIGNIFICANT_FIGURES)
export const baMajorMm = (n: number) =>
  roundSignificant(BA_DIAMETER_FACTOR * (BA_PITCH_RATIO ** n) ** BA_DIAMETER_EXPONENT, BA_SIGNIFICANT_FIGURES)

const baThreads = (): ThreadSpec[] =>
  Array.from({ length: BA_MAX + 1 }, (_, n) => ({ series: 'BA', size: String(n), majorMm: baMajorMm(n), pitchMm: baPitchMm(n) }))

// ---------- ISO metric (ISO 261 sizes and pitches) ----------

/** ISO 261, first and second choice sizes M1–M64: [nominal mm, coarse pitch, ...fine pitches]. */
export const ISO_261: readonly (readonly number[])[] = [
  [1, 0.25, 0.2], [1.2, 0.25, 0.2], [1.4, 0.3, 0.2], [1.6, 0.35, 0.2], [1.8, 0.35, 0.2],
  [2, 0.4, 0.25], [2.2, 0.45, 0.25], [2.5, 0.45, 0.35], [3, 0.5, 0.35], [3.5, 0.6, 0.35],
  [4, 0.7, 0.5], [4.5, 0.75, 0.5], [5, 0.8, 0.5], [6, 1, 0.75], [7, 1, 0.75],
  [8, 1.25, 1, 0.75], [10, 1.5, 1.25, 1, 0.75], [12, 1.75, 1.5, 1.25, 1], [14, 2, 1.5, 1.25, 1],
  [16, 2, 1.5, 1], [18, 2.5, 2, 1.5, 1], [20, 2.5, 2, 1.5, 1], [22, 2.5, 2, 1.5, 1],
  [24, 3, 2, 1.5, 1], [27, 3, 2, 1.5, 1], [30, 3.5, 3, 2, 1.5, 1], [33, 3.5, 3, 2, 1.5],
  [36, 4, 3, 2, 1.5], [39, 4, 3, 2, 1.5], [42, 4.5, 4, 3, 2, 1.5], [45, 4.5, 4, 3, 2, 1.5],
  [48, 5, 4, 3, 2, 1.5], [52, 5, 4, 3, 2, 1.5], [56, 5.5, 4, 3, 2, 1.5], [60, 5.5, 4, 3, 2, 1.5],
  [64, 6, 4, 3, 2, 1.5],
]

const metricThreads = (): ThreadSpec[] =>
  ISO_261.flatMap(([d, coarse, ...fine]) => [
    { series: 'M' as const, size: String(d), majorMm: d, pitchMm: coarse },
    ...fine.map((p) => ({ series: 'MF' as const, size: String(d), majorMm: d, pitchMm: p })),
  ])

// ---------- Unified (ASME B1.1) ----------

/** ASME B1.1 numbered sizes: major = 0.060 + 0.013·N in. */
export const UN_NUMBER_BASE_IN = 0.06
export const UN_NUMBER_STEP_IN = 0.013

/** ASME B1.1 UNC and UNF sizes used here, #0 to 1 in: [size, UNC tpi or null, UNF tpi]. */
export const UN_SIZES: readonly (readonly [string, number | null, number])[] = [
  ['#0', null, 80], ['#1', 64, 72], ['#2', 56, 64], ['#3', 48, 56], ['#4', 40, 48], ['#5', 40, 44],
  ['#6', 32, 40], ['#8', 32, 36], ['#10', 24, 32], ['#12', 24, 28],
  ['1/4', 20, 28], ['5/16', 18, 24], ['3/8', 16, 24], ['7/16', 14, 20], ['1/2', 13, 20],
  ['9/16', 12, 18], ['5/8', 11, 18], ['3/4', 10, 16], ['7/8', 9, 14], ['1', 8, 12],
]

/** Inches from `#10`, `1/4` or `1`. */
export function inchSize(size: string): number {
  if (size.startsWith('#')) return UN_NUMBER_BASE_IN + UN_NUMBER_STEP_IN * Number(size.slice(1))
  const [num, den] = size.split('/').map(Number)
  return den ? num / den : num
}

const inchThread = (series: ThreadSeries, size: string, tpi: number): ThreadSpec => {
  const majorIn = Number(inchSize(size).toFixed(4))
  return { series, size, majorIn, tpi, majorMm: majorIn * MM_PER_IN, pitchMm: MM_PER_IN / tpi }
}

const unifiedThreads = (): ThreadSpec[] =>
  UN_SIZES.flatMap(([size, unc, unf]) => [
    ...(unc ? [inchThread('UNC', size, unc)] : []),
    inchThread('UNF', size, unf),
  ])

// ---------- Whitworth form: BSW, BSF (BS 84) and Model Engineer ----------

/** BS 84 BSW and BSF threads per inch: [size, BSW tpi, BSF tpi or null]. */
export const WHITWORTH_SIZES: readonly (readonly [string, number, number | null])[] = [
  ['1/8', 40, null], ['3/16', 24, 32], ['7/32', 24, 28], ['1/4', 20, 26], ['5/16', 18, 22],
  ['3/8', 16, 20], ['7/16', 14, 18], ['1/2', 12, 16], ['5/8', 11, 14], ['3/4', 10, 12],
  ['7/8', 9, 11], ['1', 8, 10],
]

/**
 * Model Engineer series: Whitworth form at a constant 40 or 32 tpi [common practice].
 * 40 tpi covers 1/8–3/8 in and 32 tpi 1/4–1/2 in (size range from memory; the sizes are the usual taps).
 */
export const ME_SIZES: Readonly<Record<number, readonly string[]>> = {
  40: ['1/8', '5/32', '3/16', '7/32', '1/4', '9/32', '5/16', '3/8'],
  32: ['1/4', '9/32', '5/16', '3/8', '7/16', '1/2'],
}

const whitworthThreads = (): ThreadSpec[] => [
  ...WHITWORTH_SIZES.flatMap(([size, bsw, bsf]) => [
    inchThread('BSW', size, bsw),
    ...(bsf ? [inchThread('BSF', size, bsf)] : []),
  ]),
  ...Object.entries(ME_SIZES).flatMap(([tpi, sizes]) => sizes.map((s) => inchThread('ME', s, Number(tpi)))),
]

/** Every thread the workshop arithmetic knows, in a stable order. */
export const THREAD_CATALOGUE: readonly ThreadSpec[] = [
  ...baThreads(), ...metricThreads(), ...unifiedThreads(), ...whitworthThreads(),
]
