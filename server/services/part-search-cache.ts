import { catalogueVersion } from './part-search-index'

/**
 * Answers of the parts search (one page's part ids, the total and the parsed query), so that
 * the searches a workshop repeats all day ("m3 nut", "brass round") skip the parse, the SQL
 * filters and the ranking. Stock figures are never cached: the caller reads them afresh.
 * Any change to the catalogue this process makes moves catalogueVersion on and so empties the
 * cache; changes another process makes (a second server on the same PostgreSQL) show after at
 * most MAX_AGE_MS, the same bound the word index keeps.
 */

/** Entries kept; past this the least recently used goes (each holds a page of ids: ~1 KB). */
const MAX_ENTRIES = 2000
/** As INDEX_MAX_AGE_MS in part-search-index.ts: five minutes. */
const MAX_AGE_MS = 5 * 60 * 1000

interface Entry<T> {
  version: number
  at: number
  value: Promise<T>
}

const entries = new Map<string, Entry<unknown>>()

/** The cached answer for `key`, or `compute()`'s, remembered under the version seen before it ran. */
export function cachedSearch<T>(key: string, compute: () => Promise<T>): Promise<T> {
  const version = catalogueVersion()
  const hit = entries.get(key)
  entries.delete(key)
  if (hit && hit.version === version && Date.now() - hit.at < MAX_AGE_MS) {
    entries.set(key, hit) // most recently used last
    return hit.value as Promise<T>
  }
  // Concurrent identical searches share one computation; a failed one is not kept.
  const value = compute()
  const entry = { version, at: Date.now(), value }
  entries.set(key, entry)
  if (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value!)
  value.catch(() => { if (entries.get(key) === entry) entries.delete(key) })
  return value
}

/** For tests and the benchmark's cold figures. */
export function clearSearchCache() {
  entries.clear()
}
