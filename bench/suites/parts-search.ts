/**
 * GET /api/parts?q= over a 50,000-part catalogue, signed in, through the whole middleware stack.
 * The server caches which parts answer a query (server/services/part-search-cache.ts), so every
 * figure comes three ways: cache misses (the trade mix with the cache emptied before each
 * request, or queries never asked before), cache hits (the trade mix again), and the goal rows'
 * mixed workload: of every four requests three repeat the trade mix and one is new. Throughput
 * is a ratio to a bare Express JSON route, with autocannon in its own process (bench/load.ts),
 * the same connections and duration, in the same run.
 */
import { setFlagsFromString } from 'node:v8'
import { runInNewContext } from 'node:vm'
import { percentile, record } from '../harness'
import { cannon as runLoad } from '../load'
import { latencies, listenLocally, startBareServer, startSignInStackServer } from './baseline'
import { seedCatalogue } from './parts-catalogue'
import { QUERY_MIX, distinctQueries } from './parts-queries'
import { createTestApp } from '../../tests/helpers/app'
import { rawSession } from '../../tests/helpers/raw-session'
import { clearSearchCache } from '../../server/services/part-search-cache'

const PARTS = 50_000
/** Rounds through the query mix for the latency figures (× 18 queries = 540 samples). */
const ROUNDS = 30
const CONNECTIONS = 10
const DURATION_S = 10
const P95_GOAL_MS = 15
const RATIO_GOAL = 0.5
/** The mixed workload: this many repeated trade-mix requests to each never-asked query. */
const REPEATS_PER_NEW = 3
const MIXED = `mixed: 3 of 4 repeat the trade mix, 1 of 4 new`

const MIB = 1024 * 1024

/** V8's full collection, switched on at run time (node's --expose-gc flag does the same). */
function fullGc() {
  setFlagsFromString('--expose-gc')
  ;(runInNewContext('gc') as () => void)()
}

const toPath = (q: string) => `/api/parts?q=${encodeURIComponent(q)}`
const mixPaths = QUERY_MIX.map(toPath)

/** `n` paths of the mixed workload, taking its new queries from `fresh`. */
function mixedPaths(n: number, fresh: string[]): string[] {
  return Array.from({ length: n }, (_, i) => i % (REPEATS_PER_NEW + 1) === REPEATS_PER_NEW
    ? toPath(fresh.shift()!)
    : mixPaths[(i - Math.floor(i / (REPEATS_PER_NEW + 1))) % mixPaths.length])
}

async function sample(base: string, paths: string[], headers: Record<string, string>, before?: () => void) {
  const times: number[] = []
  for (const p of paths) {
    before?.()
    times.push(...await latencies(base, p, 1, { headers }))
  }
  return times
}

function latencyFigures(label: string, t: number[], goal = false) {
  const p95 = percentile(t, 95)
  record({ figure: `GET /api/parts?q= ${label} p50`, value: percentile(t, 50), unit: 'ms' })
  record({ figure: `GET /api/parts?q= ${label} p95`, value: p95, unit: 'ms', ...(goal ? { goal: `≤ ${P95_GOAL_MS} ms`, pass: p95 <= P95_GOAL_MS } : {}) })
}

/** The same load for every route compared: its own process, same connections and duration. */
async function load(url: string, headers: Record<string, string>, paths: string[]) {
  const r = await runLoad({ url, connections: CONNECTIONS, duration: DURATION_S, headers, paths })
  if (r.non2xx || r.errors) throw new Error(`load on ${paths[0]} had ${r.non2xx} non-2xx and ${r.errors} errors`)
  if (r.wrapped && paths.length > mixPaths.length) throw new Error('ran out of never-asked queries: make distinctQueries() longer')
  return r.requests.average
}

export const partsSearchSuite = {
  name: `parts search: GET /api/parts?q= over ${PARTS.toLocaleString('en-GB')} parts`,
  async run() {
    const t = await createTestApp()
    const server = await listenLocally(t.app)
    const base = server.url
    const bare = await startBareServer()
    const signInStack = await startSignInStackServer(t.config)
    const fresh = distinctQueries()
    try {
      record({ figure: `seed ${PARTS} parts in one transaction`, value: await seedCatalogue(t.dataSource, PARTS), unit: 'ms' })
      const headers = { cookie: (await rawSession(base, 'keeper')).cookie }
      const t0 = performance.now()
      await fetch(`${base}/api/parts?q=whistle`, { headers }) // the first text query builds the word index
      record({ figure: 'first text search (builds the word index)', value: performance.now() - t0, unit: 'ms' })
      for (const p of mixPaths) {
        const body = await (await fetch(base + p, { headers })).json()
        console.log(`  ${decodeURIComponent(p.slice(13)).padEnd(20)} ${String(body.total).padStart(6)} parts`)
      }
      const health = await latencies(base, '/api/health', ROUNDS * mixPaths.length, { headers })
      record({ figure: 'GET /api/health, signed in (the middleware floor) p50', value: percentile(health, 50), unit: 'ms' })
      record({ figure: 'GET /api/health, signed in (the middleware floor) p95', value: percentile(health, 95), unit: 'ms' })
      const rounds = Array.from({ length: ROUNDS }, () => mixPaths).flat()
      latencyFigures('trade mix, cache emptied before each (all misses)', await sample(base, rounds, headers, clearSearchCache))
      latencyFigures('trade mix again (all cache hits)', await sample(base, rounds, headers))
      latencyFigures(`(${MIXED})`, await sample(base, mixedPaths(rounds.length, fresh), headers), true)

      const bareRate = await load(bare.url, {}, ['/bare'])
      const check = await (await fetch(`${signInStack.url}/bare`, { headers })).json() as { signedIn: boolean }
      if (!check.signedIn) throw new Error('the sign-in stack baseline did not see the session')
      const stackRate = await load(signInStack.url, headers, ['/bare'])
      const healthRate = await load(base, headers, ['/api/health'])
      const half = Math.floor(fresh.length / 2)
      const missRate = await load(base, headers, fresh.splice(0, half).map(toPath))
      const hitRate = await load(base, headers, mixPaths)
      const mixedRate = await load(base, headers, mixedPaths(fresh.length * (REPEATS_PER_NEW + 1), fresh))
      record({ figure: `bare Express JSON route (${CONNECTIONS} conn, ${DURATION_S} s, load from another process)`, value: bareRate, unit: 'req/s' })
      record({ figure: 'bare route behind only the sign-in stack (session + passport), signed in', value: stackRate, unit: 'req/s' })
      record({ figure: 'GET /api/health, signed in (same app, whole middleware stack)', value: healthRate, unit: 'req/s' })
      record({ figure: 'GET /api/parts?q= never-asked queries (all cache misses)', value: missRate, unit: 'req/s' })
      record({ figure: 'GET /api/parts?q= trade mix (all cache hits)', value: hitRate, unit: 'req/s' })
      record({ figure: `GET /api/parts?q= (${MIXED})`, value: mixedRate, unit: 'req/s' })
      record({ figure: 'parts search, all misses ÷ bare Express route', value: missRate / bareRate, unit: 'ratio' })
      record({ figure: `parts search (${MIXED}) ÷ bare Express route`, value: mixedRate / bareRate, unit: 'ratio', goal: `≥ ${RATIO_GOAL}`, pass: mixedRate / bareRate >= RATIO_GOAL })
      record({ figure: 'signed-in /api/health ÷ bare Express route (the middleware floor)', value: healthRate / bareRate, unit: 'ratio' })
      // The most any signed-in route could reach: the search goal's ratio cannot exceed this.
      record({ figure: 'sign-in stack alone ÷ bare Express route (ceiling of any signed-in route)', value: stackRate / bareRate, unit: 'ratio' })
      // Server and benchmark share this process, and earlier suites (the client build, uploads)
      // ran in it too: RSS is what the OS gives the whole process, the heap after a full
      // collection is what the server's data holds (word index, caches, sessions).
      record({ figure: `process RSS after the ${PARTS.toLocaleString('en-GB')}-part run (whole bench process)`, value: process.memoryUsage().rss / MIB, unit: 'MiB' })
      fullGc()
      record({ figure: 'JS heap in use after a full garbage collection', value: process.memoryUsage().heapUsed / MIB, unit: 'MiB' })
    } finally {
      await Promise.all([bare.close(), signInStack.close(), server.close()])
      await t.close()
    }
  },
}
