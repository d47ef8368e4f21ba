import Fuse from 'fuse.js'
import { In, type SelectQueryBuilder } from 'typeorm'
import { Part } from '../entities'
import { db } from '../db'
import { searchIndex, textCandidates, type IndexedPart } from './part-search-index'
import { toPartSummaries } from './part-summaries'
import { cachedSearch } from './part-search-cache'
import { parsePartQuery, type PartQuery } from '../../shared/domain/part-query'
import { partListQuery, type PartListQuery } from '../../shared/schemas/part-list'
import type { PartSearchPage } from '../../shared/types/part'

/**
 * Sizes within 1 % are the same stock under either unit: 3/8" (9.525 mm) bar is listed as
 * 9.5 mm, 1/4" (6.35 mm) hex as 6.3 mm. The floor covers gasket thicknesses like 0.4 mm.
 */
const SIZE_TOLERANCE = 0.01
const MIN_SIZE_TOLERANCE_MM = 0.005
/**
 * Candidates ranked with fuse.js in one search: the best by word-match score. The rest follow
 * in word-match order; fuse costs about 0.05 ms a candidate, so this keeps ranking near 5 ms.
 */
const RANK_LIMIT = 100
/** fuse.js: 0 is an exact match, 1 anything; 0.45 keeps one- and two-letter slips. */
const FUSE_THRESHOLD = 0.45
/** fuse.js key weights: a part is named for what it is; codes and tags help. */
const FUSE_KEYS = [{ name: 'name', weight: 2 }, { name: 'code', weight: 1.5 }, { name: 'tags', weight: 1 }]
/** Above every string a material column holds (used for prefix ranges that can use the index). */
const PREFIX_END = '\uffff'

const tolerance = (mm: number) => Math.max(mm * SIZE_TOLERANCE, MIN_SIZE_TOLERANCE_MM)

/** Adds the parsed query's filters to the query builder: indexed columns only. */
function applyFilters(qb: SelectQueryBuilder<Part>, q: PartQuery, kind?: string, includeArchived = false) {
  // Written as NOT so the planner never picks the archived index (true for almost every row)
  // over a selective one: SQLite has no statistics to tell them apart without ANALYZE.
  if (!includeArchived) qb.andWhere('NOT p.archived')
  if (kind) qb.andWhere('p.kind = :kind', { kind })
  // A form or thread already implies the kind; repeating it would tempt the planner onto the
  // (kind, threadKey) index, which narrows 50,000 parts only to the 30,000 fasteners.
  if (q.kind && !q.form && !q.threadKey) qb.andWhere('p.kind = :qkind', { qkind: q.kind })
  if (q.form) qb.andWhere('p.form = :form', { form: q.form })
  if (q.threadKey) qb.andWhere('p.threadKey = :threadKey', { threadKey: q.threadKey })
  if (q.material) qb.andWhere('p.material >= :mat AND p.material < :matEnd', { mat: q.material, matEnd: q.material + PREFIX_END })
  if (q.lengthMm !== undefined) {
    qb.andWhere('p.lengthMm BETWEEN :lenLo AND :lenHi', { lenLo: q.lengthMm - tolerance(q.lengthMm), lenHi: q.lengthMm + tolerance(q.lengthMm) })
  }
  const size = q.sizeMm === undefined ? undefined : 'p.sizeMm BETWEEN :sizeLo AND :sizeHi'
  // "threadKey >= '1/4-' AND < '1/4.'" is every thread of that size ('.' follows '-').
  const thread = q.threadSize ? 'p.threadKey >= :tsLo AND p.threadKey < :tsHi' : undefined
  const params = {
    sizeLo: (q.sizeMm ?? 0) - tolerance(q.sizeMm ?? 0), sizeHi: (q.sizeMm ?? 0) + tolerance(q.sizeMm ?? 0),
    tsLo: `${q.threadSize}-`, tsHi: `${q.threadSize}.`,
  }
  if (size && thread) qb.andWhere(`((${size}) OR (${thread}))`, params)
  else if (size || thread) qb.andWhere(size ?? thread!, params)
}

const hasFilters = (q: PartQuery, kind?: string) =>
  Boolean(kind || q.kind || q.form || q.threadKey || q.threadSize || q.material || q.lengthMm !== undefined || q.sizeMm !== undefined)

/** Orders candidates: fuse.js score over name, code and tags, then the word-match score, then code. */
function rank(candidates: Map<number, number>, parts: Map<number, IndexedPart>, text: string): number[] {
  const byWords = [...candidates.keys()].map((id) => parts.get(id)!).filter(Boolean)
    .sort((a, b) => candidates.get(b.id)! - candidates.get(a.id)! || (a.code < b.code ? -1 : 1))
  const head = byWords.slice(0, RANK_LIMIT)
  const fuse = new Fuse(head, { keys: FUSE_KEYS, includeScore: true, ignoreLocation: true, threshold: FUSE_THRESHOLD })
  const fuseScore = new Map(fuse.search(text).map((r) => [r.item.id, r.score ?? 1]))
  const score = (id: number) => (fuseScore.get(id) ?? 1) - candidates.get(id)! / 10
  head.sort((a, b) => score(a.id) - score(b.id) || (a.code < b.code ? -1 : 1))
  return [...head, ...byWords.slice(RANK_LIMIT)].map((p) => p.id)
}

/** An exact part code or label code (a scanned QR typed into the box) finds that part alone. */
async function exactMatch(raw: string, includeArchived: boolean): Promise<Part | null> {
  const token = raw.trim().toUpperCase()
  if (!token || /\s/.test(token)) return null
  const part = await db().getRepository(Part).findOne({ where: [{ code: token }, { labelCode: token }] })
  return part && (includeArchived || !part.archived) ? part : null
}

/** What a search decides before reading rows: the page's part ids in order, and the total. */
interface SearchAnswer {
  ids: number[]
  total: number
  understood: PartQuery
}

/** The cache key: the query as the parser and the exact-code look-up see it (case and spacing do not matter to either). */
const cacheKey = (p: ReturnType<typeof partListQuery.parse>) =>
  JSON.stringify([p.q.toLowerCase().replace(/\s+/g, ' '), p.kind ?? '', p.includeArchived, p.page, p.pageSize])

/**
 * GET /api/parts: filters on indexed columns first, then ranks the candidates by the leftover
 * words with fuse.js, then paginates. With filters the words only rank (so "hex nut m4" still
 * lists every M4 nut, hex-named first); without filters the words choose the candidates.
 * Which parts make the page is cached (part-search-cache.ts); their rows and stock are read afresh.
 */
export async function searchParts(raw: PartListQuery): Promise<PartSearchPage> {
  const p = partListQuery.parse(raw)
  const { ids, total, understood } = await cachedSearch(cacheKey(p), () => answer(p))
  const items = await toPartSummaries(await partsInOrder(ids))
  return { items, total, page: p.page, pageSize: p.pageSize, understood }
}

async function answer(p: ReturnType<typeof partListQuery.parse>): Promise<SearchAnswer> {
  const understood = parsePartQuery(p.q)
  const exact = await exactMatch(p.q, p.includeArchived)
  if (exact && (!p.kind || exact.kind === p.kind)) return { ids: [exact.id], total: 1, understood }

  const qb = db().getRepository(Part).createQueryBuilder('p')
  applyFilters(qb, understood, p.kind, p.includeArchived)
  const skip = (p.page - 1) * p.pageSize
  if (!understood.text) {
    // Ids of the page first (sorting ids and codes, not whole rows); the caller reads those rows.
    const [pageIds, total] = await Promise.all([
      qb.clone().select('p.id', 'id').orderBy('p.code', 'ASC').offset(skip).limit(p.pageSize).getRawMany<{ id: number }>(),
      qb.getCount(),
    ])
    return { ids: pageIds.map((r) => Number(r.id)), total, understood }
  }
  const ix = await searchIndex()
  const candidates = textCandidates(ix, understood.text)
  let ordered: number[]
  if (hasFilters(understood, p.kind)) {
    const filtered: { id: number }[] = await qb.select('p.id', 'id').orderBy('p.code', 'ASC').getRawMany()
    const inText = new Map(filtered.filter((r) => candidates.has(r.id)).map((r) => [r.id, candidates.get(r.id)!]))
    const ranked = rank(inText, ix.parts, understood.text)
    ordered = [...ranked, ...filtered.map((r) => r.id).filter((id) => !inText.has(id))]
  } else {
    const live = p.includeArchived ? candidates : await withoutArchived(candidates)
    ordered = rank(live, ix.parts, understood.text)
  }
  return { ids: ordered.slice(skip, skip + p.pageSize), total: ordered.length, understood }
}

/** The parts with these ids, in the order given. */
async function partsInOrder(ids: number[]): Promise<Part[]> {
  const rows = ids.length ? await db().getRepository(Part).findBy({ id: In(ids) }) : []
  const byId = new Map(rows.map((r) => [r.id, r]))
  return ids.map((id) => byId.get(id)!).filter(Boolean)
}

/** Drops archived parts from text candidates (the in-memory index holds every part). */
async function withoutArchived(candidates: Map<number, number>): Promise<Map<number, number>> {
  if (!candidates.size) return candidates
  const archived: { id: number }[] = await db().getRepository(Part).createQueryBuilder('p')
    .select('p.id', 'id').where('p.archived = :a', { a: true }).getRawMany()
  for (const { id } of archived) candidates.delete(id)
  return candidates
}
