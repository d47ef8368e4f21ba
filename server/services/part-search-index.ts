import type { DataSource } from 'typeorm'
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
 * (and their prefixes and one-typo neighbours) give a small candidate set to rank with fuse.js
 * instead of ranking all 50,000 parts. Rebuilt lazily after any part write in this process, and
 * at least every INDEX_MAX_AGE_MS for writes made by another process (seeding, a second server).
 */
interface SearchIndex {
  parts: Map<number, IndexedPart>
  postings: Map<string, number[]>
  /** Every indexed word, sorted, for prefix look-up. */
  vocab: string[]
  version: number
  builtAt: number
}

/** Five minutes: how stale the index may get when another process edits the catalogue. */
const INDEX_MAX_AGE_MS = 5 * 60 * 1000
/** Shortest word looked up as a prefix (search as you type); one letter would match everything. */
const MIN_PREFIX = 2
/** Word lengths from which one, and from which two, typing errors are forgiven. */
const ONE_TYPO_FROM = 4
const TWO_TYPOS_FROM = 8
/** How much an exact, prefix and one-typo word match count for in the candidate order. */
const MATCH_WEIGHT = { exact: 1, prefix: 0.8, typo: 0.6 }

let version = 0
const indexes = new WeakMap<DataSource, SearchIndex>()
const building = new WeakMap<DataSource, Promise<SearchIndex>>()

/** Marks the index out of date; the next search rebuilds it. */
export function partsChanged() {
  version++
}

/** Splits text into lower-case search words: "7BA-STUD-12, brass" → 7ba stud 12 brass. */
export function searchWords(text: string): string[] {
  return text.toLowerCase().split(/[^a-z0-9./#]+/).map((w) => w.replace(/^[./]+|[./]+$/g, '')).filter(Boolean)
}

async function build(ds: DataSource): Promise<SearchIndex> {
  const started = version
  const rows = await ds.getRepository(Part).find({ select: { id: true, code: true, name: true, tags: true } })
  const parts = new Map<number, IndexedPart>()
  const postings = new Map<string, number[]>()
  for (const r of rows) {
    parts.set(r.id, { id: r.id, code: r.code, name: r.name, tags: r.tags ?? [] })
    const words = new Set([...searchWords(r.name), ...searchWords(r.code), r.code.toLowerCase(), ...(r.tags ?? []).flatMap(searchWords)])
    for (const w of words) {
      const list = postings.get(w)
      if (list) list.push(r.id)
      else postings.set(w, [r.id])
    }
  }
  return { parts, postings, vocab: [...postings.keys()].sort(), version: started, builtAt: Date.now() }
}

/** The current index for the app's database, (re)built when out of date. */
export async function searchIndex(): Promise<SearchIndex> {
  const ds = db()
  const ix = indexes.get(ds)
  if (ix && ix.version === version && Date.now() - ix.builtAt < INDEX_MAX_AGE_MS) return ix
  let pending = building.get(ds)
  if (!pending) {
    pending = build(ds).finally(() => building.delete(ds))
    building.set(ds, pending)
  }
  const fresh = await pending
  indexes.set(ds, fresh)
  return fresh
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
    for (const v of ix.vocab) {
      if (Math.abs(v.length - word.length) <= max && v !== word && editDistance(word, v, max) <= max) add(v, MATCH_WEIGHT.typo)
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
