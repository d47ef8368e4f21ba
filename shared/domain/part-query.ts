/**
 * Reads a parts search the way people in the trade type it (`7ba nut`, `m3 x 12 stainless`,
 * `brass hex 1/4`, `3/8 round bms`, `gasket 0.4`) into filters on the indexed part columns,
 * leaving the other words for fuzzy ranking. Pure: the server search and the client both use it.
 */
import { MM_PER_IN } from './drill-sizes'
import { parseThread, threadKey as keyOfThread } from './threads'
import {
  FASTENER_WORDS, KIND_PHRASES, KIND_WORDS, MATERIAL_PATTERNS, SECTION_WORDS, correctWord,
} from './part-query-words'
import type { PartKind } from '../types/domain'

export interface PartQuery {
  kind?: PartKind
  /** Fastener type (stud, nut …) or bar section (round, hex …). */
  form?: string
  /** Thread key as shared/domain/threads keyOf writes it: `7BA`, `M3x0.5`, `1/4-20UNC`. */
  threadKey?: string
  /** An inch or numbered size typed without tpi or series (`1/4 nut`): any thread of that size. */
  threadSize?: string
  lengthMm?: number
  /** Bar diameter / across flats / width, or gasket thickness. With threadSize: either may match. */
  sizeMm?: number
  /** Canonical material (part-query-words canonicalMaterial); parts match by prefix. */
  material?: string
  /** Words left for fuzzy ranking over names, codes and tags. */
  text: string
  /** Words read as a near-by trade word: "studd" → "stud". */
  corrections?: { from: string; to: string }[]
}

interface State {
  q: PartQuery
  /** What is left of the query; consumed spans become spaces. */
  rest: string
}

/** Inch sizes to the micrometre: 3/8" = 9.525 mm exactly. */
const MM_PLACES = 3
const inchToMm = (inches: number) => Number((inches * MM_PER_IN).toFixed(MM_PLACES))
const NUM = '(\\d+(?:\\.\\d+)?)'
/** Not glued to another word, number, decimal point or fraction. */
const START = '(?<![\\w.\\/#])'
const END = '(?![\\w.\\/])'

function normalise(input: string): string {
  return input.toLowerCase().replace(/[×✕]/g, 'x').replace(/[″”“]/g, '"').replace(/(\d),(\d)/g, '$1.$2')
    .replace(/[,;()]+/g, ' ').replace(/\s+/g, ' ').trim()
}

/** Replaces each match `use` accepts with a space (or with what `use` returns, when a string). */
function take(s: State, pattern: string, use: (g: (string | undefined)[]) => boolean | string) {
  s.rest = s.rest.replace(new RegExp(pattern, 'g'), (...a: unknown[]) => {
    const r = use(a.slice(0, -2) as (string | undefined)[])
    return r === true ? ' ' : r === false ? (a[0] as string) : ` ${r} `
  })
}

export function parsePartQuery(input: string): PartQuery {
  const s: State = { q: { text: '' }, rest: ` ${normalise(input)} ` }
  takeKindPhrases(s)
  takeMaterials(s)
  takeThreads(s)
  takeWords(s)
  takeNumbers(s)
  s.q.text = s.rest.split(' ').filter((w) => w && !/^(x|mm|-|\*)$/.test(w)).join(' ')
  return s.q
}

function takeKindPhrases(s: State) {
  for (const phrase of KIND_PHRASES) {
    const { kind, keep } = KIND_WORDS[phrase]
    take(s, `(?<!\\w)${phrase}(?!\\w)`, () => {
      s.q.kind ??= kind
      return keep ? phrase.replace('-', ' ') : true
    })
  }
}

function takeMaterials(s: State) {
  for (const m of MATERIAL_PATTERNS) {
    take(s, m.re.source, ([, next]) => {
      if (s.q.material) return false
      const graded = next !== undefined && m.grade?.test(next)
      s.q.material = graded ? `${m.canonical} ${next}` : m.canonical
      return graded || next === undefined ? true : next
    })
  }
}

const setThread = (s: State, key: string | null) => {
  if (!key || s.q.threadKey) return false
  s.q.threadKey = key
  s.q.kind = 'fastener'
  return true
}

function takeThreads(s: State) {
  take(s, `${START}(\\d{1,2}) ?b\\.?a\\.?${END}|${START}ba ?(\\d{1,2})${END}`, ([, a, b]) =>
    setThread(s, keyOfThread(`${a ?? b}BA`)))
  take(s, `${START}m${NUM}(?: ?[x*] ?${NUM})?(?: ?mm)?${END}`, ([, size, second]) => {
    if (second === undefined) return setThread(s, keyOfThread(`M${size}`))
    if (setThread(s, keyOfThread(`M${size}x${second}`))) return true
    // Not a pitch of that size, so the trade's "M3 x 12": thread and length.
    if (!setThread(s, keyOfThread(`M${size}`))) return false
    s.q.lengthMm = Number(second)
    return true
  })
  const size = '(#\\d{1,2}|no\\.? ?\\d{1,2}|\\d+ ?\\/ ?\\d+|\\d*\\.\\d+|\\d+)(?: ?(?:"|in|inch))?'
  const tpi = '(?: ?(-|x) ?(\\d{2,3})(?: ?tpi)?)?'
  const series = '(?: ?(unc|unf|bsw|bsf|me|whit|whitworth|w))?'
  take(s, `${START}${size}${tpi}${series}${END}`, ([whole, sz, sep, count, word]) => {
    if (!count && !word) return false
    // "25 x 40" is a flat bar's width and length, not a thread; numbered threads are written 4-40.
    if (sz && /^\d+$/.test(sz) && sep === 'x') return false
    const p = parseThread(whole!)
    return p.ok ? setThread(s, keyOfThread(whole!)) : false
  })
}

type WordMeaning =
  | { fastener: string } | { section: string } | { kind: PartKind; keep: boolean } | { material: string }

function meaningOf(word: string): WordMeaning | undefined {
  if (FASTENER_WORDS[word]) return { fastener: FASTENER_WORDS[word] }
  if (SECTION_WORDS[word]) return { section: SECTION_WORDS[word] }
  if (KIND_WORDS[word]) return KIND_WORDS[word]
  const material = MATERIAL_PATTERNS.find((m) => m.start.test(word) && m.synonyms.includes(word))
  return material ? { material: material.canonical } : undefined
}

function takeWords(s: State) {
  const kept: string[] = []
  const words = s.rest.split(' ').filter(Boolean)
  // Fastener types first, so that in "round nut" the nut decides and "round" is left to rank by.
  const isFastener = (w: string) => Boolean(FASTENER_WORDS[w])
  for (const word of [...words.filter(isFastener), ...words.filter((w) => !isFastener(w))]) {
    let meaning = /^[a-z]/.test(word) ? meaningOf(word) : undefined
    const corrected = meaning || !/^[a-z]+$/.test(word) ? undefined : correctWord(word)
    if (corrected) meaning = meaningOf(corrected)
    if (!meaning || !applyWord(s.q, meaning)) {
      kept.push(word)
      continue
    }
    if (corrected) (s.q.corrections ??= []).push({ from: word, to: corrected })
    if ('keep' in meaning && meaning.keep) kept.push(corrected ?? word)
  }
  s.rest = ` ${kept.join(' ')} `
}

/** Applies one recognised word; false when it clashes with what the query already says. */
function applyWord(q: PartQuery, m: WordMeaning): boolean {
  if ('fastener' in m) {
    if (q.kind && q.kind !== 'fastener' && q.kind !== 'stock') return false
    if (q.kind === 'fastener' && q.form) return false
    q.kind = 'fastener'
    q.form = m.fastener
    return true
  }
  if ('section' in m) {
    if (q.form || (q.kind && q.kind !== 'stock')) return false
    q.kind = 'stock'
    q.form = m.section
    return true
  }
  if ('material' in m) {
    if (q.material) return false
    q.material = m.material
    return true
  }
  if (q.kind && q.kind !== m.kind) return false
  q.kind = m.kind
  return true
}

/** A number with its unit: `12`, `12mm`, `0.4`, `3/8`, `1/4"`, `1 in`. Fractions are always inches. */
const QTY = '(\\d+ ?\\/ ?\\d+|\\d+(?:\\.\\d+)?)(?: ?(mm|"|in|inch))?'
interface Qty { mm: number; inchFraction?: string }

function qty(value: string, unit: string | undefined): Qty | undefined {
  const f = /^(\d+) ?\/ ?(\d+)$/.exec(value)
  if (f) {
    const [num, den] = [Number(f[1]), Number(f[2])]
    if (!num || !den) return undefined
    const g = gcd(num, den)
    return { mm: inchToMm(num / den), inchFraction: den / g === 1 ? String(num / g) : `${num / g}/${den / g}` }
  }
  return unit && unit !== 'mm' ? { mm: inchToMm(Number(value)) } : { mm: Number(value) }
}

function takeNumbers(s: State) {
  const q = s.q
  const size = (v?: Qty) => !!v && q.sizeMm === undefined && ((q.sizeMm = v.mm), true)
  const length = (v?: Qty) => !!v && q.lengthMm === undefined && ((q.lengthMm = v.mm), true)
  take(s, `${START}(?:ø|dia\\.?) ?${QTY}${END}`, ([, v, u]) => size(qty(v!, u)))
  take(s, `${START}${QTY} ?(?:dia|diam|diameter|od|af|a\\/f|thick)${END}`, ([, v, u]) => size(qty(v!, u)))
  take(s, `${START}${QTY} ?(?:long|lg)${END}`, ([, v, u]) => length(qty(v!, u)))
  if (q.kind === 'fastener') take(s, `(?<= )x ?${QTY}(?!\\w)`, ([, v, u]) => length(qty(v!, u)))
  take(s, `${START}${QTY}(?!\\w)`, ([, v, u]) => {
    const n = qty(v!, u)
    return !!n && (n.inchFraction || (u && u !== 'mm') ? takeInch(q, n) : takePlainNumber(q, n.mm))
  })
}

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b))

/** An inch size: a bar size, a thread size, a length, or (no context) a thread or bar size. */
function takeInch(q: PartQuery, n: Qty): boolean {
  if (q.kind === 'stock' || q.kind === 'gasket') return q.sizeMm === undefined && ((q.sizeMm = n.mm), true)
  if (q.kind === 'fastener' && (q.threadKey || q.threadSize)) return q.lengthMm === undefined && ((q.lengthMm = n.mm), true)
  if (q.threadSize || q.sizeMm !== undefined || (q.kind && q.kind !== 'fastener')) return false
  if (n.inchFraction) q.threadSize = n.inchFraction
  if (q.kind !== 'fastener') q.sizeMm = n.mm
  return true
}

/** A bare number is a fastener's length or a bar's or gasket's size; elsewhere it stays text. */
function takePlainNumber(q: PartQuery, n: number): boolean {
  if (q.kind === 'fastener' && q.lengthMm === undefined) return (q.lengthMm = n), true
  if ((q.kind === 'stock' || q.kind === 'gasket') && q.sizeMm === undefined) return (q.sizeMm = n), true
  return false
}
