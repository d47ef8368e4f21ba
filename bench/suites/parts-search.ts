/**
 * GET /api/parts?q= over a 50,000-part catalogue: latency p50/p95 over a mix of trade queries
 * (signed in, through the whole middleware stack), and throughput as a ratio to a bare Express
 * JSON route with the same autocannon connections and duration, in the same run.
 */
import type { AddressInfo } from 'node:net'
import autocannon from 'autocannon'
import { percentile, record } from '../harness'
import { latencies, startBareServer } from './baseline'
import { seedCatalogue } from './parts-catalogue'
import { createTestApp } from '../../tests/helpers/app'
import { DEMO_USERS } from '../../seeds/demo-users'

const PARTS = 50_000
/** Rounds through the query mix for the latency figures (× 18 queries = 540 samples). */
const ROUNDS = 30
const CONNECTIONS = 10
const DURATION_S = 10
const P95_GOAL_MS = 15
const RATIO_GOAL = 0.5

/** What people type, as in the issue, plus an empty box, a typo and a plain word. */
export const QUERY_MIX = [
  '7ba nut', 'm3 x 12 stainless', 'M4x0.5', '5/32-40 stud', '1/4 unc', 'brass hex 1/4', '3/8 round bms', 'gasket 0.4',
  'thread locker', 'studd', 'bras', '6ba stud 20 brass', 'whistle valve', '', 'copper tube', 'm6 x 20 screw',
  'pb round 16', 'injectr clack',
]
const paths = QUERY_MIX.map((q) => `/api/parts?q=${encodeURIComponent(q)}`)

/** Signs in over HTTP as the storekeeper and returns the session cookie. */
async function signIn(base: string): Promise<string> {
  const first = await fetch(`${base}/api/auth/session`)
  const cookie = first.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ')
  const { csrfToken } = await first.json()
  const user = DEMO_USERS.find((u) => u.role === 'storekeeper')!
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST', headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
    body: JSON.stringify({ username: user.username, password: user.password }),
  })
  if (!res.ok) throw new Error(`sign-in failed: ${res.status}`)
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ') || cookie
}

const cannon = (url: string, headers: Record<string, string>, list: string[]) =>
  autocannon({ url, connections: CONNECTIONS, duration: DURATION_S, headers, requests: list.map((path) => ({ method: 'GET', path })) })

export const partsSearchSuite = {
  name: `parts search: GET /api/parts?q= over ${PARTS.toLocaleString('en-GB')} parts`,
  async run() {
    const t = await createTestApp()
    const server = t.app.listen(0, '127.0.0.1')
    await new Promise((r) => server.once('listening', r))
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
    const bare = await startBareServer()
    try {
      record({ figure: `seed ${PARTS} parts in one transaction`, value: await seedCatalogue(t.dataSource, PARTS), unit: 'ms' })
      const cookie = await signIn(base)
      const headers = { cookie }
      const t0 = performance.now()
      await fetch(`${base}/api/parts?q=whistle`, { headers }) // the first text query builds the word index
      record({ figure: 'first text search (builds the word index)', value: performance.now() - t0, unit: 'ms' })
      for (const p of paths) {
        const res = await fetch(base + p, { headers })
        const body = await res.json()
        console.log(`  ${decodeURIComponent(p.slice(13)).padEnd(20)} ${String(body.total).padStart(6)} parts`)
      }
      const health = await latencies(base, '/api/health', ROUNDS * paths.length, { headers })
      record({ figure: 'GET /api/health, signed in (the middleware floor) p50', value: percentile(health, 50), unit: 'ms' })
      record({ figure: 'GET /api/health, signed in (the middleware floor) p95', value: percentile(health, 95), unit: 'ms' })
      const samples: number[] = []
      for (let r = 0; r < ROUNDS; r++) for (const p of paths) samples.push(...await latencies(base, p, 1, { headers }))
      const p95 = percentile(samples, 95)
      record({ figure: 'GET /api/parts?q= (trade query mix) p50', value: percentile(samples, 50), unit: 'ms' })
      record({ figure: 'GET /api/parts?q= (trade query mix) p95', value: p95, unit: 'ms', goal: `≤ ${P95_GOAL_MS} ms`, pass: p95 <= P95_GOAL_MS })

      const bareRun = await cannon(bare.url, {}, ['/bare'])
      const healthRun = await cannon(base, headers, ['/api/health'])
      const partsRun = await cannon(base, headers, paths)
      if (partsRun.non2xx || partsRun.errors) throw new Error(`parts run had ${partsRun.non2xx} non-2xx and ${partsRun.errors} errors`)
      const ratio = partsRun.requests.average / bareRun.requests.average
      record({ figure: `bare Express JSON route (${CONNECTIONS} conn, ${DURATION_S} s)`, value: bareRun.requests.average, unit: 'req/s' })
      record({ figure: 'GET /api/health, signed in (same app, whole middleware stack)', value: healthRun.requests.average, unit: 'req/s' })
      record({ figure: 'GET /api/parts?q= (query mix)', value: partsRun.requests.average, unit: 'req/s' })
      record({ figure: 'parts search ÷ bare Express route', value: ratio, unit: 'ratio', goal: `≥ ${RATIO_GOAL}`, pass: ratio >= RATIO_GOAL })
      record({ figure: 'parts search ÷ signed-in /api/health on the same app', value: partsRun.requests.average / healthRun.requests.average, unit: 'ratio' })
      // Server and benchmark share this process; the 50,000-part database and word index dominate.
      record({ figure: `process RSS after the ${PARTS.toLocaleString('en-GB')}-part run`, value: process.memoryUsage().rss / 1024 / 1024, unit: 'MiB' })
    } finally {
      bare.close()
      server.close()
      await t.close()
    }
  },
}
