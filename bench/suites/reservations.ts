import { percentile, record, round } from '../harness'
import { createTestApp } from '../../tests/helpers/app'
import { rawPoster, rawSession } from '../../tests/helpers/raw-session'
import { inTransaction } from '../../server/db'
import { Bin, BuildLine, Rack, Reservation, Workshop } from '../../server/entities'
import { createPart } from '../../server/services/parts'
import { receiveInto } from '../../server/services/stock'
import { stockTotalsOf } from '../../server/services/stock-totals'
import { checkLedger } from '../../server/services/ledger-check'
import { burst } from '../load'
import { listenLocally, startBareServer } from './baseline'

/** The issue's goal: 200 concurrent reservation requests against 50 in stock grant exactly 50. */
const REQUESTS = 200
const IN_STOCK = 50
const LINES_PER_BUILD = 50
/** The issue's goal for the rate of that race. */
const RATE_GOAL = 500
/** Measured races after the warm-up; the rate reported is their median. */
const RACES = 5

/** What one race needs: a part with IN_STOCK on hand and REQUESTS build lines of it asking for 1 each. */
async function setUpRace(round: number, base: string, post: ReturnType<typeof rawPoster>, t: Awaited<ReturnType<typeof createTestApp>>) {
  const part = await inTransaction(async (tx) => {
    const w = await tx.save(Workshop, { name: `Bench workshop ${round}` })
    const rack = await tx.save(Rack, { code: `Z${round}`, name: 'Bench rack', workshopId: w.id })
    const bin = await tx.save(Bin, { code: `Z${round}-01`, labelCode: `B-BENCH-Z${round}01`, description: '', rackId: rack.id, retired: false, defaultPartId: null })
    const p = await createPart(tx, { code: `BENCH-NUT-${round}`, name: 'Bench nut', attributes: { kind: 'fastener', type: 'nut', thread: '8BA', material: 'brass' } })
    await receiveInto(tx, { partId: p.id, binId: bin.id, quantity: IN_STOCK, reason: 'bench' }, 1)
    return p
  })
  const lines: { buildId: number; lineId: number }[] = []
  for (let b = 0; b < REQUESTS / LINES_PER_BUILD; b++) {
    const build = (await post('/api/builds', { name: `Bench build ${round}.${b + 1}` })).body as { id: number }
    const text = Array.from({ length: LINES_PER_BUILD }, () => `${part.code},1`).join('\n')
    await post(`/api/builds/${build.id}/lines/import`, { text, dryRun: false })
    const rows = await t.dataSource.getRepository(BuildLine).findBy({ buildId: build.id })
    lines.push(...rows.map((l) => ({ buildId: build.id, lineId: l.id })))
  }
  return { part, lines }
}

/**
 * 200 build lines of one part each asking for 1, fired at once over HTTP at a listening server.
 * A first race warms the server up (a server that has run for a while has its reservation code
 * compiled; the first burst after start-up measures the JIT compiler); then RACES races, each on
 * its own part and builds, give the median rate. Every race must grant exactly 50 and oversell none.
 */
export const reservationsSuite = {
  name: `reservations: ${REQUESTS} concurrent requests against ${IN_STOCK} in stock`,
  async run() {
    const t = await createTestApp()
    const server = await listenLocally(t.app)
    const bare = await startBareServer()
    try {
      const base = server.url
      const builder = await rawSession(base, 'builder')
      const post = rawPoster(base, builder)
      const races: { granted: number; refused: number; oversold: number; rate: number; bareRate: number; latencies: number[] }[] = []
      for (let n = 0; n <= RACES; n++) {
        const { part, lines } = await setUpRace(n, base, post, t)
        // The 200 requests come from another process, as 200 phones would: not from the server's own event loop.
        const { answers, ms } = await burst(base, builder, lines.map((l) => ({ path: `/api/builds/${l.buildId}/reserve`, body: { lineId: l.lineId } })))
        // The same burst at a bare Express JSON POST route: what this machine's HTTP allows just now.
        const bareRun = await burst(bare.url, { cookie: '', token: '' }, lines.map((l) => ({ path: '/bare', body: { lineId: l.lineId } })))
        const held = (await t.dataSource.getRepository(Reservation).findBy({ partId: part.id })).reduce((a, r) => a + r.quantity, 0)
        const { onHand } = await stockTotalsOf(part.id)
        const race = {
          granted: answers.filter((a) => a.status === 200).length,
          refused: answers.filter((a) => a.status === 409).length,
          oversold: Math.max(0, held - onHand),
          rate: REQUESTS / (ms / 1000),
          bareRate: REQUESTS / (bareRun.ms / 1000),
          latencies: answers.map((a) => a.ms),
        }
        console.log(`  ${n ? `race ${n}` : 'warm-up'}: ${race.granted} granted, ${race.refused} refused, ${round(race.rate)} req/s (bare ${round(race.bareRate)} req/s)`)
        if (n) races.push(race)
      }
      const ledger = await checkLedger(t.dataSource)
      const median = (xs: number[]) => percentile(xs, 50)
      const rate = median(races.map((r) => r.rate))
      const bareRate = median(races.map((r) => r.bareRate))
      const all = races.flatMap((r) => r.latencies)
      const every = (f: (r: typeof races[number]) => boolean) => races.every(f)
      record({ figure: `reservations granted of ${REQUESTS} (${IN_STOCK} in stock), in each of ${RACES} races`, value: Math.min(...races.map((r) => r.granted)), unit: 'count', goal: `= ${IN_STOCK}`, pass: every((r) => r.granted === IN_STOCK) })
      record({ figure: 'reservations oversold (Σ reserved − on hand), worst race', value: Math.max(...races.map((r) => r.oversold)), unit: 'pcs', goal: '= 0', pass: every((r) => r.oversold === 0) })
      record({ figure: 'refused with 409 INSUFFICIENT_STOCK, fewest in a race', value: Math.min(...races.map((r) => r.refused)), unit: 'count', goal: `= ${REQUESTS - IN_STOCK}`, pass: every((r) => r.refused === REQUESTS - IN_STOCK) })
      record({ figure: `reservation requests handled per second, median of ${RACES} races after a warm-up`, value: rate, unit: 'req/s', goal: `≥ ${RATE_GOAL}/s`, pass: rate >= RATE_GOAL })
      record({ figure: `the same bursts of ${REQUESTS} POSTs at a bare Express JSON route, median`, value: bareRate, unit: 'req/s' })
      record({ figure: 'reservations/s ÷ bare Express POSTs/s (medians)', value: rate / bareRate, unit: 'ratio' })
      record({ figure: 'reservation request latency p50 (all in flight at once)', value: percentile(all, 50), unit: 'ms' })
      record({ figure: 'reservation request latency p95 (all in flight at once)', value: percentile(all, 95), unit: 'ms' })
      record({ figure: 'ledger differences after the races', value: ledger.differences.length, unit: 'lots', goal: '= 0', pass: ledger.differences.length === 0 })
    } finally {
      await Promise.all([bare.close(), server.close()])
      await t.close()
    }
  },
}
