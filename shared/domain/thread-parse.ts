/** Reads thread designations the way people type them. */
import { BA_MAX, ISO_261, SERIES_NAME, THREAD_CATALOGUE, type ThreadSeries, type ThreadSpec } from './thread-data'
import { designationOf, formatNumber, keyOf } from './thread-names'
import { inchValue, suggestByText, suggestFromHint } from './thread-suggest'
import { MM_PER_IN } from './drill-sizes'

export type ThreadParse =
  | { ok: true; spec: ThreadSpec; notes: string[] }
  | { ok: false; message: string; suggestions: string[] }

const EXAMPLES = '7BA, M3, M4x0.5, 1/4-20 UNC, #4-40, 5/32-40 ME or 1/4 BSW'

/** Series picked when a size and tpi fit several: the dash form is the Unified way of writing. */
const INCH_PRIORITY: readonly ThreadSeries[] = ['UNC', 'UNF', 'ME', 'BSW', 'BSF']
const SERIES_WORDS: Record<string, ThreadSeries> = {
  unc: 'UNC', unf: 'UNF', me: 'ME', bsw: 'BSW', w: 'BSW', whit: 'BSW', whitworth: 'BSW', bsf: 'BSF',
}
/** Two sizes closer than this are the same inch size (tables give 4 decimals). */
const INCH_MATCH = 0.0005

const BA_RE = /^(\d{1,3}) ?b\.?a\.?$|^b\.?a\.? ?(\d{1,3})$/
const METRIC_RE = /^m ?(\d+(?:\.\d+)?)(?: ?(?:x|\*|-) ?(\d+(?:\.\d+)?))?(?: ?mm)?(?: ?-? ?\d[gh])?$/
const INCH_RE =
  /^(#|no\.? ?)?(\d+ ?\/ ?\d+|\d*\.\d+|\d+) ?(?:"|''|in|inch)? ?(?:(?:-|x|\*| ) ?(\d{1,3}) ?(?:tpi)?)? ?(unc|unf|bsw|bsf|me|w|whit|whitworth)?(?: ?-? ?[123][ab])?$/

const ok = (spec: ThreadSpec, notes: string[] = []): ThreadParse => ({ ok: true, spec, notes })
const fail = (message: string, suggestions: string[]): ThreadParse => ({
  ok: false,
  message: suggestions.length ? `${message} Did you mean ${suggestions.join(', ')}?` : message,
  suggestions,
})

function normalise(input: string): string {
  return input.trim().toLowerCase().replace(/[×✕]/g, 'x').replace(/[″”“]/g, '"')
    .replace(/(\d),(\d)/g, '$1.$2').replace(/\s+/g, ' ')
}

/** Parses `7BA`, `M3`, `M4 x 0.5`, `1/4-20`, `1/4" UNC`, `#4-40`, `5/32-40 ME`, `5/32 x 40`, `1/4 BSW`, … */
export function parseThread(input: string): ThreadParse {
  const text = normalise(input)
  if (!text) return fail(`Give a thread designation, e.g. ${EXAMPLES}.`, [])
  return parseBa(text) ?? parseMetric(text) ?? parseInch(text) ??
    fail(`"${input.trim()}" is not a thread designation we can read; write it like ${EXAMPLES}.`, suggestByText(text))
}

/** The stable search key (see keyOf) of a typed designation, or null when it is not a known thread. */
export function threadKey(input: string): string | null {
  const p = parseThread(input)
  return p.ok ? keyOf(p.spec) : null
}

function parseBa(text: string): ThreadParse | null {
  const m = BA_RE.exec(text)
  if (!m) return null
  const n = Number(m[1] ?? m[2])
  const spec = THREAD_CATALOGUE.find((t) => t.series === 'BA' && Number(t.size) === n)
  if (spec) return ok(spec)
  return fail(`BA sizes run from 0BA to ${BA_MAX}BA (BS 93:2008); there is no ${n}BA.`, suggestFromHint({ family: 'BA', size: n }))
}

function parseMetric(text: string): ThreadParse | null {
  const m = METRIC_RE.exec(text)
  if (!m) return null
  const size = Number(m[1])
  const pitch = m[2] === undefined ? undefined : Number(m[2])
  const hint = { family: 'metric' as const, size, pitchMm: pitch }
  const row = ISO_261.find(([d]) => d === size)
  if (!row) return fail(`M${formatNumber(size)} is not an ISO 261 size.`, suggestFromHint(hint))
  const sized = THREAD_CATALOGUE.filter((t) => (t.series === 'M' || t.series === 'MF') && t.majorMm === size)
  if (pitch === undefined) return ok(sized.find((t) => t.series === 'M')!)
  const spec = sized.find((t) => Math.abs(t.pitchMm - pitch) < 1e-9)
  if (spec) return ok(spec)
  const [, coarse, ...fine] = row
  const fines = fine.map(formatNumber).join(', ')
  return fail(
    `M${formatNumber(size)} has a ${formatNumber(coarse)} mm coarse pitch or ${fines} mm fine (ISO 261), not ${formatNumber(pitch)} mm.`,
    suggestFromHint(hint),
  )
}

function parseInch(text: string): ThreadParse | null {
  const m = INCH_RE.exec(text)
  if (!m) return null
  const [, numbered, rawSize, rawTpi, word] = m
  const tpi = rawTpi === undefined ? undefined : Number(rawTpi)
  const series = word ? SERIES_WORDS[word] : undefined
  const sizes = sizeReadings(rawSize.replace(/ /g, ''), Boolean(numbered), tpi !== undefined)
  if (!sizes.length) return null
  const matching = (size: string) => THREAD_CATALOGUE.filter((t) =>
    t.tpi !== undefined && t.size === size && (tpi === undefined || t.tpi === tpi) && (!series || t.series === series))
  const size = sizes.find((s) => matching(s).length) ?? sizes[0]
  const found = matching(size).sort((a, b) => INCH_PRIORITY.indexOf(a.series) - INCH_PRIORITY.indexOf(b.series))
  const label = `${size}${size.startsWith('#') ? '' : '"'}`
  if (!found.length) {
    const what = [series ? `${series}` : 'UNC, UNF, ME, BSW or BSF', `thread is ${label}`, tpi ? `with ${tpi} tpi` : ''].join(' ')
    const hints = sizes.map((s) => ({ family: 'inch' as const, size: inchValue(s), pitchMm: tpi ? MM_PER_IN / tpi : undefined, series }))
    return fail(`No ${what.trim()}.`, suggestFromHint(hints))
  }
  if (tpi === undefined && found.length > 1) {
    const all = found.map(designationOf)
    const what = `${label}${series ? ` ${series}` : ''}`
    return fail(`${what} alone could be ${all.length} threads: add the threads per inch${series ? '' : ' or the series'}.`, all)
  }
  return ok(found[0], found.slice(1).map(sameCountNote))
}

const sameCountNote = (t: ThreadSpec) =>
  `${designationOf(t)} (${SERIES_NAME[t.series]}) has the same size and tpi; write "${designationOf(t)}" if you meant that one.`

/** The inch sizes a typed size could mean, most likely first; empty when it is no inch size at all. */
function sizeReadings(raw: string, numbered: boolean, hasTpi: boolean): string[] {
  if (numbered) return /^\d+$/.test(raw) ? [`#${Number(raw)}`] : []
  if (raw.includes('/')) {
    const [num, den] = raw.split('/').map(Number)
    if (!num || !den) return []
    const g = gcd(num, den)
    return [den / g === 1 ? String(num / g) : `${num / g}/${den / g}`]
  }
  if (raw.includes('.')) {
    const value = Number(raw)
    const known = THREAD_CATALOGUE.find((t) => t.majorIn !== undefined && !t.size.startsWith('#') && Math.abs(t.majorIn - value) < INCH_MATCH)
    return [known ? known.size : raw]
  }
  const n = Number(raw)
  // A bare whole number is a numbered size (4-40) unless it can only be whole inches (1-8, 1 UNC).
  return hasTpi || n !== 1 ? [`#${n}`, String(n)] : [String(n), `#${n}`]
}

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b))
