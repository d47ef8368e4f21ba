import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import request from 'supertest'
import type { Express } from 'express'
import { loadConfig, type Config } from '../../server/config'
import { openDatabase } from '../../server/database'
import { createApp } from '../../server/app'
import { seedDemo } from '../../seeds/demo'
import { DEMO_USERS } from '../../seeds/demo-users'
import { User } from '../../server/entities'
import { hashPassword } from '../../server/services/users'
import { freshDatabase, onPostgres } from './test-database'
import type { Role } from '../../shared/types/api'

export interface TestAppOptions {
  /** Load the whole demo scenario (parts, bins, stock, builds); otherwise only the demo users. */
  demo?: boolean
  config?: Partial<Config>
}

/**
 * createApp on a fresh database with migrations run, one per test file: a temporary SQLite
 * file, or a new PostgreSQL database when the tests run against PostgreSQL (TEST_PG_URL).
 */
export async function createTestApp(options: TestAppOptions = {}) {
  const dir = mkdtempSync(join(tmpdir(), 'binwright-test-'))
  const database = await freshDatabase(dir)
  const config = loadConfig({}, {
    DATABASE_PATH: join(dir, 'test.sqlite'),
    ...(onPostgres ? { DATABASE_URL: database.location } : {}),
    UPLOAD_DIR: join(dir, 'uploads'),
    SESSION_SECRET: 'a-test-secret-of-enough-length',
    LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'silent',
    ...options.config,
  })
  const dataSource = await openDatabase(config.database)
  if (options.demo) await seedDemo(dataSource)
  else {
    for (const u of DEMO_USERS) {
      await dataSource.getRepository(User).save({
        username: u.username, displayName: u.displayName, role: u.role, email: u.email,
        active: true, passwordHash: await hashPassword(u.password),
      })
    }
  }
  const app = createApp(config)
  const close = async () => {
    await dataSource.destroy()
    await database.drop()
    rmSync(dir, { recursive: true, force: true })
  }
  return { app, dataSource, config, dir, close }
}

/** A supertest agent with a session, that sends the CSRF token on every state-changing call. */
export interface Client {
  agent: ReturnType<typeof request.agent>
  token: string
  get: (url: string) => request.Test
  post: (url: string, body?: object | string) => request.Test
  patch: (url: string, body?: object) => request.Test
  put: (url: string, body?: object) => request.Test
  delete: (url: string) => request.Test
}

/** A client signed in as `username` (or signed out when none is given). */
export async function clientFor(app: Express, username?: string, password?: string): Promise<Client> {
  const agent = request.agent(app)
  let token: string = (await agent.get('/api/auth/session').expect(200)).body.csrfToken
  if (username) {
    const pw = password ?? DEMO_USERS.find((u) => u.username === username)?.password ?? ''
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ username, password: pw })
    if (res.status !== 200) throw new Error(`sign-in as ${username} failed: ${res.status} ${JSON.stringify(res.body)}`)
    token = res.body.csrfToken
  }
  const withToken = (t: request.Test) => t.set('x-csrf-token', token)
  return {
    agent,
    token,
    get: (url) => agent.get(url),
    post: (url, body) => withToken(agent.post(url)).send(body ?? {}),
    patch: (url, body) => withToken(agent.patch(url)).send(body ?? {}),
    put: (url, body) => withToken(agent.put(url)).send(body ?? {}),
    delete: (url) => withToken(agent.delete(url)),
  }
}

/** The demo user of a role (demo sign-ins are created in every test database). */
export const demoUser = (role: Role) => DEMO_USERS.find((u) => u.role === role)!

export const clientAs = (app: Express, role: Role) => clientFor(app, demoUser(role).username)
