import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestApp } from '../helpers/app'
import { onPostgres } from '../helpers/test-database'
import { Part, User } from '../../server/entities'

/**
 * server/data-source.ts binds whole numbers as parameters on SQLite (TypeORM writes them into
 * the SQL text), so one prepared statement serves every id. These pin what that must keep.
 */
describe.skipIf(onPostgres)('SQLite: whole-number parameters are bound, not written into the SQL', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>
  beforeAll(async () => { t = await createTestApp() })
  afterAll(() => t.close())

  it('gives one SQL text for every id, with the id bound as a parameter', () => {
    const sqlFor = (id: number) => t.dataSource.getRepository(Part).createQueryBuilder('p').where({ id }).getQueryAndParameters()
    const [sql41, params41] = sqlFor(41)
    const [sql42, params42] = sqlFor(42)
    expect(sql41).toBe(sql42)
    expect(sql42).not.toMatch(/\b42\b/)
    expect(params41).toEqual([41n])
    expect(params42).toEqual([42n])
  })

  it('binds whole numbers as INTEGER, as the literal was: integer division and typeof stay the same', async () => {
    const row = await t.dataSource.createQueryBuilder().from(User, 'u')
      .select('typeof(:n)', 'type').addSelect(':a / :b', 'quotient').addSelect(':half * 2', 'double')
      .setParameters({ n: 42, a: 10, b: 4, half: 2.5 }).limit(1).getRawOne()
    expect(row).toEqual({ type: 'integer', quotient: 2, double: 5 })
  })
})
