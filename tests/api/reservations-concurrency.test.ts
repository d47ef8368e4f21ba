import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { createTestApp } from '../helpers/app'
import { inTransaction } from '../../server/db'
import { Bin, BuildLine, Reservation } from '../../server/entities'
import { createPart } from '../../server/services/parts'
import { receiveInto } from '../../server/services/stock'
import { stockTotalsOf } from '../../server/services/stock-totals'
import { checkLedger } from '../../server/services/ledger-check'
import { signInRaw } from '../helpers/raw-session'

/** The goal in the issue: 200 parallel reservation requests against 50 free. */
const CONTENDERS = 200
const FREE = 50
/** Interleaved with them: draws of stock another build already holds, and releases. */
const DRAWS = 10
const LINES_PER_BUILD = 50

let t: Awaited<ReturnType<typeof createTestApp>>
let server: Server
let base: string

beforeAll(async () => {
  t = await createTestApp({ demo: true })
  server = t.app.listen(0, '127.0.0.1')
  await new Promise((r) => server.once('listening', r))
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
})
afterAll(async () => {
  await new Promise((r) => server.close(r))
  await t.close()
})

describe('200 parallel reservation requests against 50 free, over a listening server', () => {
  it('grants exactly 50, never holds more than is on hand, and the ledger still reconciles', async () => {
    const post = await signInRaw(base, 'builder')
    const bin = await t.dataSource.getRepository(Bin).findOneByOrFail({ code: 'A2-08' })
    const bin2 = await t.dataSource.getRepository(Bin).findOneByOrFail({ code: 'A2-09' })
    // 60 on hand, of which a prior build holds 10: 50 free when the storm starts.
    const [x, y] = await inTransaction(async (tx) => {
      const px = await createPart(tx, { code: 'RACE-NUT', name: 'Race test nut', attributes: { kind: 'fastener', type: 'nut', thread: '8BA', material: 'brass' } })
      const py = await createPart(tx, { code: 'RACE-WASHER', name: 'Race test washer', attributes: { kind: 'fastener', type: 'washer', thread: '8BA', material: 'brass' } })
      await receiveInto(tx, { partId: px.id, binId: bin.id, quantity: FREE + DRAWS, reason: 'race test' }, 1)
      await receiveInto(tx, { partId: py.id, binId: bin2.id, quantity: 20, reason: 'race test' }, 1)
      return [px, py]
    })
    const holder = (await post('/api/builds', { name: 'Earlier build' })).body as { id: number }
    await post(`/api/builds/${holder.id}/lines/import`, { text: `RACE-NUT,${DRAWS}\nRACE-WASHER,5`, dryRun: false })
    expect((await post(`/api/builds/${holder.id}/reserve`, {})).status).toBe(200)
    const holderLines = await t.dataSource.getRepository(BuildLine).find({ where: { buildId: holder.id }, order: { id: 'ASC' } })

    const contenderBuilds: { id: number; lineIds: number[] }[] = []
    for (let b = 0; b < CONTENDERS / LINES_PER_BUILD; b++) {
      const build = (await post('/api/builds', { name: `Contender ${b + 1}` })).body as { id: number }
      const text = Array.from({ length: LINES_PER_BUILD }, (_, i) => `RACE-NUT,1,line ${i + 1}`).join('\n')
      expect((await post(`/api/builds/${build.id}/lines/import`, { text, dryRun: false })).status).toBe(200)
      const lines = await t.dataSource.getRepository(BuildLine).find({ where: { buildId: build.id }, order: { id: 'ASC' } })
      contenderBuilds.push({ id: build.id, lineIds: lines.map((l) => l.id) })
    }
    expect((await stockTotalsOf(x.id)).available).toBe(FREE)

    // Fire everything at once: reserves, draws of the earlier build's holding, and a release.
    const requests: Promise<{ kind: string; status: number; body: { error?: { code: string } } }>[] = []
    let sent = 0
    for (const build of contenderBuilds) {
      for (const lineId of build.lineIds) {
        requests.push(post(`/api/builds/${build.id}/reserve`, { lineId }).then((r) => ({ kind: 'reserve', ...r })))
        // One draw of the earlier build's holding after every 20 reserves: free stock stays the same.
        if (++sent % (CONTENDERS / DRAWS) === 0) {
          requests.push(post(`/api/builds/${holder.id}/draw`, { lineId: holderLines[0].id, quantity: 1, binId: bin.id }).then((r) => ({ kind: 'draw', ...r })))
        }
        // Halfway, the earlier build lets go of another part: a release in the same queue.
        if (sent === CONTENDERS / 2) {
          requests.push(post(`/api/builds/${holder.id}/release`, { lineId: holderLines[1].id }).then((r) => ({ kind: 'release', ...r })))
        }
      }
    }
    const results = await Promise.all(requests)

    const reserves = results.filter((r) => r.kind === 'reserve')
    expect(reserves).toHaveLength(CONTENDERS)
    const granted = reserves.filter((r) => r.status === 200)
    const refused = reserves.filter((r) => r.status !== 200)
    expect(granted).toHaveLength(FREE)
    expect(new Set(refused.map((r) => `${r.status} ${r.body.error?.code}`))).toEqual(new Set(['409 INSUFFICIENT_STOCK']))
    const draws = results.filter((r) => r.kind === 'draw')
    expect(draws.length).toBe(DRAWS)
    expect(draws.every((d) => d.status === 200)).toBe(true)
    expect(results.find((r) => r.kind === 'release')!.status).toBe(200)

    const held = await t.dataSource.getRepository(Reservation).findBy({ partId: x.id })
    const sum = held.reduce((s, r) => s + r.quantity, 0)
    const totals = await stockTotalsOf(x.id)
    expect(sum).toBe(FREE)
    expect(totals).toEqual({ onHand: FREE, reserved: FREE, available: 0 })
    expect(sum).toBeLessThanOrEqual(totals.onHand)
    expect(await t.dataSource.getRepository(Reservation).countBy({ partId: y.id })).toBe(0)
    const report = await checkLedger(t.dataSource)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
  }, 60_000)
})
