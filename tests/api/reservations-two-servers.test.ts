import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestApp } from '../helpers/app'
import { startServer, type RunningServer } from '../helpers/server'
import { signInRaw } from '../helpers/raw-session'
import { onPostgres } from '../helpers/test-database'
import { inTransaction } from '../../server/db'
import { Bin, BuildLine, Reservation } from '../../server/entities'
import { createPart } from '../../server/services/parts'
import { receiveInto } from '../../server/services/stock'
import { checkLedger } from '../../server/services/ledger-check'

/**
 * On PostgreSQL several server processes may share one database, and each process's own write
 * queue cannot see the other's: only the part row locks keep them from handing out the same
 * stock. Two real servers (as `npm start` runs them) on one database; 20 parts with one of each
 * free; four builds that each want one of every part reserve all at the same moment, two
 * through each server. Every part is a race for its last item.
 */
const PARTS = 20
const BUILDS = 4

let t: Awaited<ReturnType<typeof createTestApp>>
let servers: RunningServer[] = []

beforeAll(async () => {
  if (!onPostgres) return
  t = await createTestApp({ demo: true })
  servers = await Promise.all([0, 1].map(() => startServer({ DATABASE_URL: t.config.database, LOG_LEVEL: 'error' })))
}, 120_000)
afterAll(async () => {
  await Promise.all(servers.map((s) => s.stop()))
  await t?.close()
})

describe.runIf(onPostgres)('two server processes on one PostgreSQL database', () => {
  it('hand out each last item once between them, never twice', async () => {
    const bin = await t.dataSource.getRepository(Bin).findOneByOrFail({ code: 'A2-08' })
    const parts = await inTransaction(async (tx) => {
      const made = []
      for (let i = 1; i <= PARTS; i++) {
        const p = await createPart(tx, { code: `TWIN-${i}`, name: `Two-server test nut ${i}`, attributes: { kind: 'fastener', type: 'nut', thread: '10BA', material: 'brass' } })
        await receiveInto(tx, { partId: p.id, binId: bin.id, quantity: 1, reason: 'two-server test' }, 1)
        made.push(p)
      }
      return made
    })
    const posts = await Promise.all(servers.map((s) => signInRaw(s.url, 'builder')))
    const text = parts.map((p) => `${p.code},1`).join('\n')
    const builds: number[] = []
    for (let n = 0; n < BUILDS; n++) {
      const build = (await posts[0]('/api/builds', { name: `Twin test ${n + 1}` })).body as unknown as { id: number }
      expect((await posts[0](`/api/builds/${build.id}/lines/import`, { text, dryRun: false })).status).toBe(200)
      builds.push(build.id)
    }

    // allowPartial: each build takes what is free when its turn comes and records the rest short.
    const results = await Promise.all(builds.map((id, n) => posts[n % 2](`/api/builds/${id}/reserve`, { allowPartial: true })))
    expect(results.map((r) => r.status)).toEqual(builds.map(() => 200))

    const held = await t.dataSource.getRepository(Reservation).find({ where: parts.map((p) => ({ partId: p.id })) })
    const perPart = new Map<number, number>()
    for (const r of held) perPart.set(r.partId, (perPart.get(r.partId) ?? 0) + r.quantity)
    expect(parts.map((p) => perPart.get(p.id) ?? 0)).toEqual(parts.map(() => 1))
    const short = await t.dataSource.getRepository(BuildLine).find({ where: builds.map((buildId) => ({ buildId })) })
    expect(short.reduce((s, l) => s + l.shortQuantity, 0)).toBe(PARTS * (BUILDS - 1))
    const report = await checkLedger(t.dataSource)
    expect(report.differences).toEqual([])
  }, 120_000)
})
