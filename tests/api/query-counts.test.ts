/**
 * List pages must not make a query per row (N+1): the number of SQL statements a list request
 * makes is counted through the DataSource's logger, and must not grow with the page size and
 * stay under a small bound. Counts, not timings, so a slow machine cannot fail it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Logger } from 'typeorm'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Bin } from '../../server/entities'

/** Statements one list request may make: session and user come from memory once warm. */
const MAX_QUERIES = 12

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client
let queries: string[] = []

beforeAll(async () => {
  t = await createTestApp({ demo: true })
  const logger = t.dataSource.logger
  // Wraps the logger TypeORM calls before every statement it runs.
  const counting: Logger = Object.assign(Object.create(logger) as Logger, {
    logQuery: (q: string, p?: unknown[]) => { queries.push(q); return logger.logQuery(q, p) },
  })
  Object.defineProperty(t.dataSource, 'logger', { value: counting, configurable: true })
  keeper = await clientAs(t.app, 'storekeeper')
})
afterAll(() => t.close())

async function count(url: string): Promise<{ n: number; rows: number }> {
  expect((await keeper.get(url)).status).toBe(200) // warm: session, user and settings read once
  queries = []
  const res = await keeper.get(url)
  expect(res.status).toBe(200)
  if (process.env.SHOW_QUERIES) console.log(url, queries.length, queries.map((q) => q.slice(0, 90)))
  return { n: queries.length, rows: Array.isArray(res.body.items) ? res.body.items.length : res.body.lines?.length ?? 0 }
}

describe('queries per list request', () => {
  it.each([
    ['/api/parts', 'pageSize'],
    ['/api/parts?q=brass', 'pageSize'],
    ['/api/builds', 'pageSize'],
    ['/api/orders', 'pageSize'],
    ['/api/movements', 'pageSize'],
  ])('When %s is asked for 5 or 50 rows, then it makes the same few queries', async (path, param) => {
    const join = path.includes('?') ? '&' : '?'
    const small = await count(`${path}${join}${param}=5`)
    const large = await count(`${path}${join}${param}=50`)
    expect(large.rows).toBeGreaterThanOrEqual(small.rows)
    expect(small.rows).toBeGreaterThan(0)
    // A short last page may skip its COUNT query, so never more queries for more rows.
    expect(large.n).toBeLessThanOrEqual(small.n)
    expect(large.n).toBeLessThanOrEqual(MAX_QUERIES)
  })

  it('When a bin is read after a scan, then it takes a few queries whatever it holds', async () => {
    const bins = await t.dataSource.getRepository(Bin).find({ order: { id: 'ASC' } })
    const counts = []
    for (const b of bins.slice(0, 8)) counts.push((await count(`/api/bins/${b.code}`)))
    expect(counts.some((c) => c.rows > 0)).toBe(true)
    expect(Math.max(...counts.map((c) => c.n))).toBeLessThanOrEqual(MAX_QUERIES)
    // The bin (joined with rack and workshop), its lots, their parts, their reservations.
    expect(Math.max(...counts.map((c) => c.n))).toBe(4)
  })
})
