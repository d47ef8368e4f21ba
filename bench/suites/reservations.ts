import type { AddressInfo } from 'node:net'
import { percentile, record } from '../harness'
import { createTestApp } from '../../tests/helpers/app'
import { signInRaw } from '../../tests/helpers/raw-session'
import { inTransaction } from '../../server/db'
import { Bin, BuildLine, Rack, Reservation, Workshop } from '../../server/entities'
import { createPart } from '../../server/services/parts'
import { receiveInto } from '../../server/services/stock'
import { stockTotalsOf } from '../../server/services/stock-totals'
import { checkLedger } from '../../server/services/ledger-check'
import { burst } from '../load'
import { startBareServer } from './baseline'
import { DEMO_USERS } from '../../seeds/demo-users'

/** The goal: 200 concurrent reservation requests against 50 in stock grant exactly 50. */
const REQUESTS = 200
const IN_STOCK = 50
const LINES_PER_BUILD = 50
/** The goal for the rate of that race. */
const RATE_GOAL = 500

/** A session cookie and CSRF token for `username`, for the burst client in its own process. */
async function session(base: string, username: string) {
  const first = await fetch(`${base}/api/auth/session`)
  const cookie = first.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ')
  const { csrfToken } = await first.json() as { csrfToken: string }
  const password = DEMO_USERS.find((u) => u.username === username)!.password
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie }, body: JSON.stringify({ username, password }),
  })
  const { csrfToken: token } = await res.json() as { csrfToken: string }
  return { cookie: res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ') || cookie, token }
}

/** 200 builds lines of one part each asking for 1, fired at once over HTTP at a listening server. */
export const reservationsSuite = {
  name: `reservations: ${REQUESTS} concurrent requests against ${IN_STOCK} in stock`,
  async run() {
    const t = await createTestApp()
    const server = t.app.listen(0, '127.0.0.1')
    await new Promise((r) => server.once('listening', r))
    try {
      const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
      const part = await inTransaction(async (tx) => {
        const w = await tx.save(Workshop, { name: 'Bench workshop' })
        const rack = await tx.save(Rack, { code: 'Z1', name: 'Bench rack', workshopId: w.id })
        const bin = await tx.save(Bin, { code: 'Z1-01', labelCode: 'B-BENCH-Z101', description: '', rackId: rack.id, retired: false, defaultPartId: null })
        const p = await createPart(tx, { code: 'BENCH-NUT', name: 'Bench nut', attributes: { kind: 'fastener', type: 'nut', thread: '8BA', material: 'brass' } })
        await receiveInto(tx, { partId: p.id, binId: bin.id, quantity: IN_STOCK, reason: 'bench' }, 1)
        return p
      })
      const post = await signInRaw(base, 'builder')
      const lines: { buildId: number; lineId: number }[] = []
      for (let b = 0; b < REQUESTS / LINES_PER_BUILD; b++) {
        const build = (await post('/api/builds', { name: `Bench build ${b + 1}` })).body as { id: number }
        const text = Array.from({ length: LINES_PER_BUILD }, () => 'BENCH-NUT,1').join('\n')
        await post(`/api/builds/${build.id}/lines/import`, { text, dryRun: false })
        const rows = await t.dataSource.getRepository(BuildLine).findBy({ buildId: build.id })
        lines.push(...rows.map((l) => ({ buildId: build.id, lineId: l.id })))
      }
      // The 200 requests come from another process, as 200 phones would: not from the server's own event loop.
      const { answers, ms } = await burst(base, await session(base, 'builder'),
        lines.map((l) => ({ path: `/api/builds/${l.buildId}/reserve`, body: { lineId: l.lineId } })))
      const seconds = ms / 1000
      // The same burst at a bare Express JSON POST route: what this machine's HTTP allows just now.
      const bare = await startBareServer()
      const bareRun = await burst(bare.url, { cookie: '', token: '' }, lines.map((l) => ({ path: '/bare', body: { lineId: l.lineId } })))
      bare.close()
      const results = answers.map((a) => a.status)
      const latencies = answers.map((a) => a.ms)
      const granted = results.filter((s) => s === 200).length
      const held = (await t.dataSource.getRepository(Reservation).findBy({ partId: part.id })).reduce((a, r) => a + r.quantity, 0)
      const { onHand } = await stockTotalsOf(part.id)
      const ledger = await checkLedger(t.dataSource)
      record({ figure: `reservations granted of ${REQUESTS} (${IN_STOCK} in stock)`, value: granted, unit: 'count', goal: `= ${IN_STOCK}`, pass: granted === IN_STOCK })
      record({ figure: 'reservations oversold (Σ reserved − on hand, when above 0)', value: Math.max(0, held - onHand), unit: 'pcs', goal: '= 0', pass: held <= onHand })
      record({ figure: 'refused with 409 INSUFFICIENT_STOCK', value: results.filter((s) => s === 409).length, unit: 'count', goal: `= ${REQUESTS - IN_STOCK}`, pass: results.filter((s) => s === 409).length === REQUESTS - IN_STOCK })
      record({ figure: 'reservation requests handled per second (client in its own process)', value: REQUESTS / seconds, unit: 'req/s', goal: `≥ ${RATE_GOAL}/s`, pass: REQUESTS / seconds >= RATE_GOAL })
      record({ figure: `the same burst of ${REQUESTS} POSTs at a bare Express JSON route`, value: REQUESTS / (bareRun.ms / 1000), unit: 'req/s' })
      record({ figure: 'reservations/s ÷ bare Express POSTs/s', value: bareRun.ms / ms, unit: 'ratio' })
      record({ figure: 'reservation request latency p50 (all in flight at once)', value: percentile(latencies, 50), unit: 'ms' })
      record({ figure: 'reservation request latency p95 (all in flight at once)', value: percentile(latencies, 95), unit: 'ms' })
      record({ figure: 'ledger differences after the race', value: ledger.differences.length, unit: 'lots', goal: '= 0', pass: ledger.differences.length === 0 })
    } finally {
      await new Promise((r) => server.close(r))
      await t.close()
    }
  },
}
