import { In, type DataSource } from 'typeorm'
import { Part } from '../entities'
import { db } from '../db'
import { editDistance } from '../../shared/domain/part-query-words'

/** What the text search needs of a part: the words people look for it by. */
export interface IndexedPart {
  id: number
  code: string
  name: string
  tags: string[]
}

/**
 * Word → parts index over names, codes and tags, kept in memory so that the words of a query
 * (their prefixes and one-typo neighbours) give a small candidate set for fuse.js to rank,
 * instead of ranking all 50,000 parts. Part writes in this process update it part by part
 * (partsChanged); it is rebuilt whole in the background every INDEX_MAX_AGE_MS, for writes
 * another process made (a seed run, a second server on the same PostgreSQL).
 */
interface SearchIndex {
  ds: DataSource
  parts: Map<number, IndexedPart & { words: string[] }>
  postings: Map<string, Set<number>>
  /** Every indexed word, sorted, for prefix look-up. */
  vocab: string[]
  /** Words with letters, by length: the only ones a typing error is looked for among. */
  byLength: Map<number, string[]>
  builtAt: number
}

/** Five minutes: how stale the index may get when another process edits the catalogue. */
const INDEX_MAX_AGE_MS = 5 * 60 * 1000
/** Past this many changed parts (a big CSV import) a whole rebuild is quicker than updates. */
const FULL_REBUILD_AFTER = 5000
/** Parts re-read per query when updating (well under any database's bound-parameter limit). */
const UPDATE_CHUNK = 500
/** Shortest word looked up as a prefix (search as you type); one letter would match everything. */
const MIN_PREFIX = 2
/** Word lengths from which one, and from which two, typing errors are forgiven. */
const ONE_TYPO_FROM = 4
const TWO_TYPOS_FROM = 8
/** How much an exact, prefix and one-typo word match count for in the candidate order. */
const MATCH_WEIGHT = { exact: 1, prefix: 0.8, typo: 0.6 }

let current: SearchIndex | undefined
let building: Promise<SearchIndex> | undefined
const dirty = new Set<number>()
let rebuildAll = false
/** Goes up on every catalogue change this process sees, and on every rebuild: search answers cached under an older one are stale. */
let version = 0

export const catalogueVersion = () => version

/** Marks parts as changed (or, without ids, the whole catalogue); the next search catches up. */
export function partsChanged(ids?: number[]) {
  version++
  if (!ids) rebuildAll = true
  else for (const id of ids) dirty.add(id)
  if (dirty.size > FULL_REBUILD_AFTER) rebuildAll = true
}

/**
 * Runs a catalogue write and marks the parts it wrote (`ids`, and any `work` adds to `written`)
 * changed again once it has committed or rolled back. The services mark them inside the
 * transaction too, but a search that ran meanwhile may have indexed or cached what it saw
 * before the outcome (uncommitted rows on SQLite's one connection, the old rows on
 * PostgreSQL's others).
 */
export async function afterCatalogueWrite<T>(ids: number[], work: (written: number[]) => Promise<T>): Promise<T> {
  const written = [...ids]
  try {
    return await work(written)
  } finally {
    if (written.length) partsChanged(written)
  }
}

/** Splits text into lower-case search words: "7BA-STUD-12, brass" → 7ba stud 12 brass. */
export function searchWords(text: string): string[] {
  return text.toLowerCase().split(/[^a-z0-9./#]+/).map((w) => w.replace(/^[./]+|[./]+$/g, '')).filter(Boolean)
}

type Row = Pick<Part, 'id' | 'code' | 'name' | 'tags'>

/** Reads the indexed columns with a plain query: 50,000 rows hydrate as entities 4× slower. */
async function readRows(ds: DataSource, ids?: number[]): Promise<Row[]> {
  const qb = ds.getRepository(Part).createQueryBuilder('p').select(['p.id AS id', 'p.code AS code', 'p.name AS name', 'p.tags AS tags'])
  if (ids) qb.where({ id: In(ids) })
  const raw: { id: number; code: string; name: string; tags: string | null }[] = await qb.getRawMany()
  return raw.map((r) => ({ id: Number(r.id), code: r.code, name: r.name, tags: r.tags ? JSON.parse(r.tags) as string[] : [] }))
}

/** Adds (or replaces) one part's words. Whole codes are not indexed: exact codes go to SQL. */
function put(ix: SearchIndex, r: Row) {
  if (ix.parts.has(r.id)) remove(ix, r.id)
  const set = new Set(searchWords(r.name))
  for (const w of searchWords(r.code)) set.add(w)
  for (const t of r.tags) for (const w of searchWords(t)) set.add(w)
  const words = [...set]
  ix.parts.set(r.id, { id: r.id, code: r.code, name: r.name, tags: r.tags, words })
  for (const w of words) {
    const ids = ix.postings.get(w)
    if (ids) ids.add(r.id)
    else ix.postings.set(w, new Set([r.id]))
  }
}

function remove(ix: SearchIndex, id: number) {
  for (const w of ix.parts.get(id)?.words ?? []) {
    const set = ix.postings.get(w)
    set?.delete(id)
    if (set && set.size === 0) ix.postings.delete(w)
  }
  ix.parts.delete(id)
}

function sortVocabulary(ix: SearchIndex) {
  ix.vocab = [...ix.postings.keys()].sort()
  ix.byLength = new Map()
  for (const w of ix.vocab) {
    if (!/[a-z]/.test(w)) continue
    const list = ix.byLength.get(w.length)
    if (list) list.push(w)
    else ix.byLength.set(w.length, [w])
  }
}

async function build(ds: DataSource): Promise<SearchIndex> {
  rebuildAll = false
  dirty.clear()
  const ix: SearchIndex = { ds, parts: new Map(), postings: new Map(), vocab: [], byLength: new Map(), builtAt: Date.now() }
  for (const r of await readRows(ds)) put(ix, r)
  sortVocabulary(ix)
  return ix
}

/** Re-reads the parts changed since the last search and updates their words. */
async function catchUp(ix: SearchIndex) {
  const ids = [...dirty]
  dirty.clear()
  for (let i = 0; i < ids.length; i += UPDATE_CHUNK) {
    const chunk = ids.slice(i, i + UPDATE_CHUNK)
    const rows = await readRows(ix.ds, chunk)
    const found = new Set(rows.map((r) => r.id))
    for (const id of chunk) if (!found.has(id)) remove(ix, id)
    for (const r of rows) put(ix, r)
  }
  sortVocabulary(ix)
}

function startBuild(ds: DataSource): Promise<SearchIndex> {
  building ??= build(ds).then((ix) => {
    version++ // a rebuild may bring in another process's changes
    return (current = ix)
  }).finally(() => { building = undefined })
  return building
}

/** The word index for the app's database: built on first use, kept up to date after that. */
export async function searchIndex(): Promise<SearchIndex> {
  const ds = db()
  if (!current || current.ds !== ds || rebuildAll) return startBuild(ds)
  if (Date.now() - current.builtAt > INDEX_MAX_AGE_MS) void startBuild(ds) // answer from the old one meanwhile
  if (dirty.size) await catchUp(current)
  return current
}

/** First index in the sorted vocabulary at or after `word`. */
function lowerBound(vocab: string[], word: string): number {
  let lo = 0
  let hi = vocab.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    if (vocab[mid] < word) lo = mid + 1
    else hi = mid
  }
  return lo
}

/** Parts one query word finds, each with how well: exact, as a prefix, or with a typing error. */
function matchWord(ix: SearchIndex, word: string): Map<number, number> {
  const found = new Map<number, number>()
  const add = (w: string, weight: number) => {
    for (const id of ix.postings.get(w) ?? []) if ((found.get(id) ?? 0) < weight) found.set(id, weight)
  }
  add(word, MATCH_WEIGHT.exact)
  if (word.length >= MIN_PREFIX) {
    for (let i = lowerBound(ix.vocab, word); i < ix.vocab.length && ix.vocab[i].startsWith(word); i++) {
      if (ix.vocab[i] !== word) add(ix.vocab[i], MATCH_WEIGHT.prefix)
    }
  }
  if (word.length >= ONE_TYPO_FROM && /[a-z]/.test(word)) {
    const max = word.length >= TWO_TYPOS_FROM ? 2 : 1
    for (let len = word.length - max; len <= word.length + max; len++) {
      for (const v of ix.byLength.get(len) ?? []) if (v !== word && editDistance(word, v, max) <= max) add(v, MATCH_WEIGHT.typo)
    }
  }
  return found
}

/**
 * Parts the text's words find, with a score (sum of word match weights). Parts that have every
 * word come first; when none has all of them, parts with any of them are returned.
 */
export function textCandidates(ix: SearchIndex, text: string): Map<number, number> {
  const perWord = searchWords(text).map((w) => matchWord(ix, w))
  if (perWord.length === 0) return new Map()
  const all = new Map<number, number>()
  const [first, ...others] = [...perWord].sort((a, b) => a.size - b.size)
  for (const [id, score] of first) {
    let total = score
    for (const m of others) {
      const s = m.get(id)
      if (s === undefined) { total = -1; break }
      total += s
    }
    if (total >= 0) all.set(id, total)
  }
  if (all.size) return all
  for (const m of perWord) for (const [id, s] of m) all.set(id, (all.get(id) ?? 0) + s)
  return all
}
