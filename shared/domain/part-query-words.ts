/**
 * The words people in a model-engineering stores type for materials, fastener types, bar
 * sections and kinds of part, with the one canonical name each is filed under. Used by the
 * search parser (part-query.ts) and by the parts service when it indexes a part's material.
 */
import { FASTENER_TYPES, STOCK_SECTIONS } from '../schemas/part'
import type { PartKind } from '../types/domain'

interface MaterialEntry {
  /** How the material column stores it (lower case); search filters by this prefix. */
  canonical: string
  /** What people type for it, in any case; multi-word forms allowed. */
  synonyms: string[]
  /** Short form used in suggested part codes ("7BA-STUD-12-BR"): the trade abbreviation. */
  code: string
  /** A grade that may follow and is kept with it: "stainless 303", "gunmetal lg2". */
  grade?: RegExp
}

/**
 * Materials and their trade abbreviations (common practice in British model-engineering
 * suppliers' lists: BMS bright mild steel, PB phosphor bronze, GM gunmetal, CZ brasses, EN steels).
 * "ss" is read as stainless, as most stores lists do; silver steel is always written out.
 */
export const MATERIAL_SYNONYMS: readonly MaterialEntry[] = [
  { canonical: 'mild steel', code: 'MS', synonyms: ['mild steel', 'bright mild steel', 'bright mild', 'bms', 'ms', 'en1a', 'en3'] },
  { canonical: 'stainless', code: 'SS', synonyms: ['stainless steel', 'stainless', 'ss', 's/s', 'stst'], grade: /^(30[34]|316l?|a2|a4)$/ },
  { canonical: 'silver steel', code: 'SILV', synonyms: ['silver steel'] },
  { canonical: 'phosphor bronze', code: 'PB', synonyms: ['phosphor bronze', 'phos bronze', 'phosphor-bronze', 'pb', 'pb102', 'pb1'] },
  { canonical: 'gunmetal', code: 'GM', synonyms: ['gunmetal', 'gun metal', 'gm'], grade: /^lg[24]$/ },
  { canonical: 'bronze', code: 'BRZ', synonyms: ['bronze'] },
  { canonical: 'brass', code: 'BR', synonyms: ['brass'], grade: /^cz1\d\d$/ },
  { canonical: 'copper', code: 'CU', synonyms: ['copper', 'cu'] },
  { canonical: 'aluminium', code: 'AL', synonyms: ['aluminium', 'aluminum', 'alu', 'ally', 'dural'] },
  { canonical: 'cast iron', code: 'CI', synonyms: ['cast iron', 'ci'] },
  { canonical: 'gauge plate', code: 'GP', synonyms: ['gauge plate', 'ground flat stock'] },
  { canonical: 'compressed fibre', code: 'FIB', synonyms: ['compressed fibre', 'compressed fiber'] },
  { canonical: 'gasket paper', code: 'PAP', synonyms: ['gasket paper'] },
  { canonical: 'ptfe', code: 'PTFE', synonyms: ['ptfe'] },
  { canonical: 'nylon', code: 'NYL', synonyms: ['nylon'] },
]

/** Fastener types, with the plural and variant spellings people type. */
export const FASTENER_WORDS: Record<string, (typeof FASTENER_TYPES)[number]> = {
  ...Object.fromEntries(FASTENER_TYPES.flatMap((t) => [[t, t], [`${t}s`, t]])),
  screws: 'screw', nutt: 'nut', capscrew: 'screw', capscrews: 'screw',
}

/** Bar sections, with the abbreviations stockists print ("hex", "sq", "rd"). */
export const SECTION_WORDS: Record<string, (typeof STOCK_SECTIONS)[number]> = {
  ...Object.fromEntries(STOCK_SECTIONS.map((s) => [s, s])),
  rd: 'round', hexagon: 'hex', hexagonal: 'hex', sq: 'square', tubing: 'tube', tubes: 'tube', sheets: 'sheet',
}

/**
 * Words that say which kind of part is meant. `keep` leaves the word in the text for ranking:
 * "thread locker" narrows to compounds and then ranks the thread-lockers first.
 */
export const KIND_WORDS: Record<string, { kind: PartKind; keep: boolean }> = {
  fastener: { kind: 'fastener', keep: false }, fasteners: { kind: 'fastener', keep: false },
  gasket: { kind: 'gasket', keep: false }, gaskets: { kind: 'gasket', keep: false },
  seal: { kind: 'gasket', keep: true }, seals: { kind: 'gasket', keep: true },
  packing: { kind: 'gasket', keep: true }, jointing: { kind: 'gasket', keep: true },
  bar: { kind: 'stock', keep: false }, bars: { kind: 'stock', keep: false },
  rod: { kind: 'stock', keep: false }, stock: { kind: 'stock', keep: false },
  compound: { kind: 'compound', keep: true }, oil: { kind: 'compound', keep: true },
  grease: { kind: 'compound', keep: true }, 'thread locker': { kind: 'compound', keep: true },
  threadlocker: { kind: 'compound', keep: true }, 'thread-locker': { kind: 'compound', keep: true },
  'cutting fluid': { kind: 'compound', keep: true }, 'retaining compound': { kind: 'compound', keep: true },
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')
const byLength = (a: string, b: string) => b.length - a.length

/** The synonyms of a material as one regex alternation, longest first. */
const alternation = (words: string[]) => `(?:${[...words].sort(byLength).map(escape).join('|')})`

/** One pattern per material matching a synonym as whole words, then an optional grade word. */
export const MATERIAL_PATTERNS = MATERIAL_SYNONYMS.map((m) => ({
  ...m,
  re: new RegExp(`(?<![\\w/])${alternation(m.synonyms)}(?![\\w/])(?: (\\w+))?`),
  start: new RegExp(`^${alternation(m.synonyms)}(?![\\w/])`),
}))

/** Multi-word kind phrases ("thread locker"), matched before single words. */
export const KIND_PHRASES = Object.keys(KIND_WORDS).filter((w) => /[ -]/.test(w)).sort(byLength)

/**
 * The canonical material for what someone typed or stored: "BMS" → "mild steel",
 * "Stainless steel 303" → "stainless 303", "Brass" → "brass"; unknown text is kept, lower case.
 */
export function canonicalMaterial(text: string): string {
  const s = text.trim().toLowerCase().replace(/\s+/g, ' ')
  for (const m of MATERIAL_PATTERNS) {
    const hit = m.start.exec(s)
    if (hit) return m.canonical + s.slice(hit[0].length)
  }
  return s
}

/**
 * The short form of a material for part codes: "stainless 303" → "SS303", "brass" → "BR";
 * a material not in the table gives its first three letters.
 */
export function materialCode(material: string): string {
  const canonical = canonicalMaterial(material)
  const m = MATERIAL_SYNONYMS.find((e) => canonical === e.canonical || new RegExp(`^${escape(e.canonical)}\\b`).test(canonical))
  if (!m) return canonical.replace(/[^a-z0-9]/g, '').slice(0, 3).toUpperCase()
  const grade = canonical.slice(m.canonical.length).trim().split(/[\s,]/)[0]
  return m.grade?.test(grade) ? `${m.code}${grade.toUpperCase()}` : m.code
}

/** Shortest word we correct, and shortest we correct to: below this one typo too often makes another real word (coil → oil). */
export const MIN_CORRECTABLE_LENGTH = 4

/** The base words the parser corrects typing errors towards ("studd" → stud, "bras" → brass). */
export const KNOWN_WORDS: readonly string[] = [
  ...FASTENER_TYPES, ...STOCK_SECTIONS, 'hexagon',
  ...Object.keys(KIND_WORDS).filter((w) => !/[ -]/.test(w) && !w.endsWith('s')),
  ...MATERIAL_SYNONYMS.flatMap((m) => m.synonyms).filter((w) => !/[ /]/.test(w)),
].filter((w) => w.length >= MIN_CORRECTABLE_LENGTH)

/** Optimal string alignment distance (Levenshtein plus swapped neighbours), stopping past `max`. */
export function editDistance(a: string, b: string, max = 1): number {
  if (Math.abs(a.length - b.length) > max) return max + 1
  const d = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array(b.length).fill(0)] as number[])
  for (let j = 1; j <= b.length; j++) d[0][j] = j
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost)
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1)
    }
  }
  return d[a.length][b.length]
}

/** The known word one typing error away from `word`, when there is exactly one. */
export function correctWord(word: string): string | undefined {
  if (word.length < MIN_CORRECTABLE_LENGTH || /\d/.test(word)) return undefined
  const near = KNOWN_WORDS.filter((k) => editDistance(word, k) === 1)
  return near.length === 1 ? near[0] : undefined
}
