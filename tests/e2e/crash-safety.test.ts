import { afterAll, describe, expect, it } from 'vitest'
import { rmSync } from 'node:fs'
import { join } from 'node:path'
import request from 'supertest'
import Database from 'better-sqlite3'
import { startServer, type RunningServer } from '../helpers/server'
import { openDatabase } from '../../server/database'
import { checkLedger } from '../../server/services/ledger-check'
import { sqliteMigrations as migrations } from '../../server/migrations'
import { DEMO_USERS } from '../../seeds/demo-users'

/** Writes acknowledged before the kill; in-flight requests die with the process. */
const ACKS_BEFORE_KILL = 40
const PARALLEL = 8
/** One kill in CI (each restart costs a server start, ~10 s here); CRASH_KILLS=3 for a longer run. */
const KILLS = Number(process.env.CRASH_KILLS ?? 1)

const started: RunningServer[] = []
afterAll(async () => {
  for (const s of started) if (s.process.exitCode === null && s.process.signalCode === null) s.process.kill('SIGKILL')
  rmSync(started[0]?.dir ?? '/nonexistent', { recursive: true, force: true })
})

async function signIn(url: string) {
  const agent = request.agent(url)
  let token: string = (await agent.get('/api/auth/session').expect(200)).body.csrfToken
  const keeper = DEMO_USERS.find((u) => u.role === 'storekeeper')!
  token = (await agent.post('/api/auth/login').set('x-csrf-token', token).send({ username: keeper.username, password: keeper.password }).expect(200)).body.csrfToken
  return { agent, token }
}

/** Receives and takes from PARALLEL clients until ACKS_BEFORE_KILL succeeded, then SIGKILL. */
async function burstAndKill(server: RunningServer, partId: number, binId: number, tag: string) {
  const { agent, token } = await signIn(server.url)
  let acked = 0
  let killed = false
  const worker = async (w: number) => {
    for (let i = 0; !killed; i++) {
      const take = (i + w) % 3 === 2
      const res = await agent.post(`/api/stock/${take ? 'take' : 'receive'}`).set('x-csrf-token', token)
        .send({ partId, binId, quantity: 1, reason: tag }).catch(() => null)
      if (res && res.status < 300 && !take) acked++
      if (acked >= ACKS_BEFORE_KILL && !killed) {
        killed = true
        server.process.kill('SIGKILL')
      }
    }
  }
  const exited = new Promise((r) => server.process.once('exit', r))
  await Promise.all(Array.from({ length: PARALLEL }, (_, w) => worker(w)))
  await exited
  return acked
}

describe('crash safety: SIGKILL in a burst of writes', () => {
  it(`reopens after ${KILLS} kills with every acknowledged receive kept and the ledger reconciled`, async () => {
    const first = await startServer()
    started.push(first)
    const dbPath = join(first.dir, 'e2e.sqlite')
    const env = { DATABASE_PATH: dbPath, UPLOAD_DIR: join(first.dir, 'uploads') }
    const peek = new Database(dbPath, { readonly: true })
    const { partId } = peek.prepare("SELECT id AS partId FROM parts WHERE kind = 'fastener' ORDER BY id").get() as { partId: number }
    const { binId } = peek.prepare('SELECT id AS binId FROM bins WHERE retired = 0 ORDER BY id').get() as { binId: number }
    peek.close()

    let server = first
    const acked: number[] = []
    for (let k = 0; k < KILLS; k++) {
      acked.push(await burstAndKill(server, partId, binId, `crash-${k}`))
      expect(server.process.signalCode).toBe('SIGKILL')
      server = await startServer(env)
      started.push(server)
      expect((await request(server.url).get('/api/health')).body).toEqual({ ok: true })
    }
    // The restarted server still takes writes.
    const { agent, token } = await signIn(server.url)
    await agent.post('/api/stock/receive').set('x-csrf-token', token).send({ partId, binId, quantity: 1, reason: 'after' }).expect(201)
    server.process.kill('SIGTERM')
    await new Promise((r) => server.process.once('exit', r))

    const raw = new Database(dbPath)
    expect(raw.pragma('integrity_check', { simple: true })).toBe('ok')
    for (let k = 0; k < KILLS; k++) {
      const kept = raw.prepare("SELECT COUNT(*) AS n FROM movements WHERE kind = 'receive' AND reason = ?").get(`crash-${k}`) as { n: number }
      expect(kept.n, `receives acknowledged before kill ${k + 1}`).toBeGreaterThanOrEqual(acked[k])
    }
    raw.close()
    const ds = await openDatabase(dbPath)
    const applied = await ds.query('SELECT COUNT(*) AS n FROM migrations') as { n: number }[]
    expect(applied[0].n).toBe(migrations.length)
    const report = await checkLedger(ds)
    expect(report.differences).toEqual([])
    expect(report.negativeLots).toBe(0)
    await ds.destroy()
    console.info(`crash safety: ${KILLS} kills survived; acknowledged receives kept ${acked.join(', ')}; ${report.movements} movements reconcile`)
  }, 120_000)
})
