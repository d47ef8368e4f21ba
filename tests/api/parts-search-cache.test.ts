/**
 * The parts search caches which parts answer a query (server/services/part-search-cache.ts).
 * These check that a cached answer never shows stale stock, and that every catalogue change
 * (new part, rename, archive, restore, delete) shows in the next search at once.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Logger } from 'typeorm'
import { clientAs, createTestApp, type Client } from '../helpers/app'
import { Bin, Part } from '../../server/entities'

let t: Awaited<ReturnType<typeof createTestApp>>
let keeper: Client
let queries = 0

beforeAll(async () => {
  t = await createTestApp({ demo: true })
  const logger = t.dataSource.logger
  const counting: Logger = Object.assign(Object.create(logger) as Logger, {
    logQuery: (q: string, p?: unknown[]) => { queries++; return logger.logQuery(q, p) },
  })
  Object.defineProperty(t.dataSource, 'logger', { value: counting, configurable: true })
  keeper = await clientAs(t.app, 'storekeeper')
}, 60_000)
afterAll(() => t.close())

const search = async (q: string) => (await keeper.get(`/api/parts?q=${encodeURIComponent(q)}`).expect(200)).body
const codesFor = async (q: string) => (await search(q)).items.map((p: { code: string }) => p.code)

describe('parts search cache', () => {
  it('When a query is asked again, then only the rows and stock are read (three queries)', async () => {
    const first = await search('brass round')
    queries = 0
    const again = await search('brass round')
    expect(again).toEqual(first)
    expect(queries).toBe(3) // the page's parts, on hand, reserved
  })

  it('When stock arrives, then the cached answer shows the new on-hand figure', async () => {
    const part = await t.dataSource.getRepository(Part).findOneByOrFail({ code: 'TUBE-15-CU' })
    const before = (await search('copper tube')).items.find((p: { id: number }) => p.id === part.id)
    const bin = (await t.dataSource.getRepository(Bin).find({ where: { retired: false } }))[0]
    await keeper.post('/api/stock/receive', { partId: part.id, binId: bin.id, quantity: 500, reason: 'cache test' }).expect(201)
    const after = (await search('copper tube')).items.find((p: { id: number }) => p.id === part.id)
    expect(after.onHand).toBe(before.onHand + 500)
  })

  it('When a part is added, renamed, archived, restored or deleted, then the next search shows it', async () => {
    expect(await codesFor('snifting')).toEqual([])
    const made = (await keeper.post('/api/parts', { name: 'Snifting valve', attributes: { kind: 'other', properties: {} } }).expect(201)).body
    expect(await codesFor('snifting')).toEqual([made.code])
    expect(await codesFor('zymurgy')).toEqual([])
    await keeper.patch(`/api/parts/${made.id}`, { name: 'Zymurgy pin', attributes: { kind: 'other', properties: {} } }).expect(200)
    expect(await codesFor('zymurgy')).toEqual([made.code])
    await keeper.post(`/api/parts/${made.id}/archive`).expect(200)
    expect(await codesFor(made.code)).not.toContain(made.code)
    await keeper.post(`/api/parts/${made.id}/restore`).expect(200)
    expect(await codesFor(made.code)).toEqual([made.code])
    await keeper.delete(`/api/parts/${made.id}`).expect(204)
    expect(await codesFor(made.code)).not.toContain(made.code)
  })
})
