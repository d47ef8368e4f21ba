/** Nearest valid designations for something a user typed that is not a thread we know. */
import { THREAD_CATALOGUE, inchSize, type ThreadSeries, type ThreadSpec } from './thread-data'
import { designationOf } from './thread-names'

/** How many suggestions a refusal offers: enough to spot the right one, few enough to read. */
export const SUGGESTION_COUNT = 3
/** Weight of a pitch mismatch against a diameter mismatch when ranking (both relative). */
const PITCH_WEIGHT = 0.5
/** Penalty for a candidate outside the series the user named. */
const OTHER_SERIES_PENALTY = 1

export interface SuggestHint {
  family?: 'BA' | 'metric' | 'inch'
  /** BA number, metric size in mm or inch size in inches. */
  size?: number
  pitchMm?: number
  series?: ThreadSeries
}

const familyOf = (t: ThreadSpec) => (t.series === 'BA' ? 'BA' : t.series === 'M' || t.series === 'MF' ? 'metric' : 'inch')

function sizeOf(t: ThreadSpec): number {
  if (t.series === 'BA') return Number(t.size)
  return t.majorIn ?? t.majorMm
}

function score(t: ThreadSpec, h: SuggestHint): number {
  let s = 0
  if (h.size !== undefined) {
    const size = sizeOf(t)
    s += t.series === 'BA' ? Math.abs(size - h.size) / 10 : Math.abs(size - h.size) / Math.max(h.size, 1e-3)
  }
  if (h.pitchMm !== undefined) s += (PITCH_WEIGHT * Math.abs(t.pitchMm - h.pitchMm)) / h.pitchMm
  if (h.series && t.series !== h.series) s += OTHER_SERIES_PENALTY
  return s
}

/** Ranks the catalogue against what could be read from the input (several readings: the best counts). */
export function suggestFromHint(hints: SuggestHint | SuggestHint[], limit = SUGGESTION_COUNT): string[] {
  const all = Array.isArray(hints) ? hints : [hints]
  const ranked = THREAD_CATALOGUE
    .map((t, i) => {
      const scores = all.filter((h) => !h.family || familyOf(t) === h.family).map((h) => score(t, h))
      return { d: designationOf(t), s: scores.length ? Math.min(...scores) : Infinity, i }
    })
    .filter((r) => r.s < Infinity)
    .sort((a, b) => a.s - b.s || a.i - b.i)
  return [...new Set(ranked.map((r) => r.d))].slice(0, limit)
}

/** Last resort for text we could not read at all: closest designations by edit distance. */
export function suggestByText(text: string, limit = SUGGESTION_COUNT): string[] {
  const compact = text.toLowerCase().replace(/\s+/g, '')
  return THREAD_CATALOGUE
    .map((t, i) => {
      const d = designationOf(t)
      return { d, s: editDistance(compact, d.toLowerCase().replace(/\s+/g, '')), i }
    })
    .sort((a, b) => a.s - b.s || a.i - b.i)
    .slice(0, limit)
    .map((r) => r.d)
}

/** Levenshtein distance, two rows. */
export function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j)
  for (let i = 1; i <= a.length; i++) {
    const row = [i]
    for (let j = 1; j <= b.length; j++) {
      row[j] = Math.min(prev[j] + 1, row[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1))
    }
    prev = row
  }
  return prev[b.length]
}

/** Inch size of `#10`, `1/4`, `0.25` or `1`, for ranking. */
export const inchValue = (size: string) => (/^[\d.]+$/.test(size) ? Number(size) : inchSize(size))
