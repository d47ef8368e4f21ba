import express, { type Express } from 'express'
import type { AddressInfo } from 'node:net'
import { percentile, record } from '../harness'
import { sampler } from '../load'
import { sessionMiddleware } from '../../server/app'
import { configurePassport } from '../../server/middleware/auth'
import { renewSignedInSession } from '../../server/middleware/session-renewal'
import type { Config } from '../../server/config'

/** Requests made in each latency sample run. */
const SAMPLES = 500

/** Latency of GET `path` on an already listening server, sequential requests timed from another process. */
export async function latencies(baseUrl: string, path: string, n = SAMPLES, init?: { headers?: Record<string, string> }): Promise<number[]> {
  const times: number[] = []
  for (let i = 0; i < n; i++) times.push(await sampler().time(baseUrl + path, init?.headers))
  return times
}

/** Listens on a free port of 127.0.0.1; the address to call and a close that waits for the server to stop. */
export async function listenLocally(app: Express) {
  const server = app.listen(0, '127.0.0.1')
  await new Promise((r) => server.once('listening', r))
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () => new Promise<void>((r) => server.close(() => r())),
  }
}

/** A bare Express JSON route: the baseline every route's figures are compared with. */
export async function startBareServer() {
  const app = express()
  app.get('/bare', (_req, res) => { res.json({ ok: true }) })
  app.post('/bare', express.json(), (req, res) => { res.json({ ok: true, got: req.body }) })
  return listenLocally(app)
}

/**
 * A second baseline: a bare Express JSON route behind only the sign-in stack the product must
 * use (express-session over our session store, passport's session, the cookie renewal), with
 * the app's own session options. No search can be faster than this route: the search route
 * needs a signed-in member, so this bounds any ratio of the search to the bare route.
 */
export async function startSignInStackServer(config: Config) {
  const app = express()
  app.use(sessionMiddleware(config))
  app.use(configurePassport().session())
  app.use(renewSignedInSession)
  app.get('/bare', (req, res) => { res.json({ ok: true, signedIn: Boolean(req.user) }) })
  return listenLocally(app)
}

export const baselineSuite = {
  name: 'baseline: a bare Express JSON route',
  async run() {
    const bare = await startBareServer()
    const t = await latencies(bare.url, '/bare')
    record({ figure: 'bare Express JSON route p50', value: percentile(t, 50), unit: 'ms' })
    record({ figure: 'bare Express JSON route p95', value: percentile(t, 95), unit: 'ms' })
    await bare.close()
  },
}
