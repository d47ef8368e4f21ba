import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest'
import request from 'supertest'
import { clientAs, clientFor, createTestApp } from '../helpers/app'

let t: Awaited<ReturnType<typeof createTestApp>>
beforeAll(async () => {
  t = await createTestApp({ config: { LOGIN_MAX_TRIES: 3 } })
})
afterAll(() => t.close())

describe('POST /api/auth/login', () => {
  it('signs in with the right password and reports the user and role', async () => {
    const c = await clientFor(t.app)
    const res = await c.post('/api/auth/login', { username: 'keeper', password: 'brass-keeper-1' })
    expect(res.status).toBe(200)
    expect(res.body.user).toMatchObject({ username: 'keeper', role: 'storekeeper' })
    expect(res.body.csrfToken).toMatch(/^[0-9a-f]{64}$/)
    const cookie = String(res.headers['set-cookie'])
    expect(cookie).toMatch(/binwright\.sid=/)
    expect(cookie).toMatch(/HttpOnly/)
    expect(cookie).toMatch(/SameSite=Lax/)
  })

  it('refuses a wrong password with 401 and the error shape', async () => {
    const c = await clientFor(t.app)
    const res = await c.post('/api/auth/login', { username: 'builder', password: 'not-the-password' })
    expect(res.status).toBe(401)
    expect(res.body).toEqual({ error: { code: 'BAD_CREDENTIALS', message: 'Username or password is not right.' } })
  })

  it('changes the session id at sign-in', async () => {
    const first = await request(t.app).get('/api/auth/session')
    const anon = String(first.headers['set-cookie']).split(';')[0]
    expect(anon).toMatch(/^binwright\.sid=.+/)
    const login = (body: object) => request(t.app).post('/api/auth/login').set('cookie', anon).set('x-csrf-token', first.body.csrfToken).send(body)
    expect((await login({ username: 'nobody', password: 'x' })).status).toBe(401)
    const res = await login({ username: 'viewer', password: 'brass-viewer-1' })
    const signedIn = String(res.headers['set-cookie']).split(';')[0]
    expect(signedIn).toMatch(/^binwright\.sid=.+/)
    expect(signedIn).not.toBe(anon)
  })

  it('answers 429 after too many wrong passwords for one user', async () => {
    const c = await clientFor(t.app)
    const statuses: number[] = []
    for (let i = 0; i < 4; i++) {
      statuses.push((await c.post('/api/auth/login', { username: 'keeper', password: `wrong-${i}` })).status)
    }
    expect(statuses).toEqual([401, 401, 401, 429])
    const blocked = await c.post('/api/auth/login', { username: 'keeper', password: 'brass-keeper-1' })
    expect(blocked.status).toBe(429)
    expect(blocked.body.error.code).toBe('TOO_MANY_TRIES')
  })

  it('refuses a sign-in without the CSRF token', async () => {
    const res = await request(t.app).post('/api/auth/login').send({ username: 'keeper', password: 'brass-keeper-1' })
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('CSRF_TOKEN')
  })
})

describe('POST /api/auth/logout', () => {
  it('ends the session on the server, so the old cookie no longer signs in', async () => {
    const c = await clientAs(t.app, 'builder')
    expect((await c.get('/api/auth/session')).body.user.username).toBe('builder')
    expect((await c.post('/api/auth/logout')).status).toBe(204)
    expect((await c.get('/api/auth/session')).body.user).toBeNull()
  })

  it('refuses the old cookie after sign-out even when replayed by another client', async () => {
    const first = await request(t.app).get('/api/auth/session')
    const anon = String(first.headers['set-cookie']).split(';')[0]
    const login = await request(t.app).post('/api/auth/login').set('cookie', anon).set('x-csrf-token', first.body.csrfToken)
      .send({ username: 'builder', password: 'brass-builder-1' })
    const cookie = String(login.headers['set-cookie']).split(';')[0]
    expect((await request(t.app).get('/api/builds').set('cookie', cookie)).status).toBe(200)
    const logout = await request(t.app).post('/api/auth/logout').set('cookie', cookie).set('x-csrf-token', login.body.csrfToken)
    expect(logout.status).toBe(204)
    const replay = await request(t.app).get('/api/builds').set('cookie', cookie)
    expect(replay.status).toBe(401)
  })
})

describe('session lifetime', () => {
  afterEach(() => { vi.useRealTimers() })
  const expiresOf = (setCookie: string) => Date.parse(/Expires=([^;]+)/.exec(setCookie)![1])

  it('sends the cookie again with a fresh 12 hours every ten minutes of use, not on every answer', async () => {
    const c = await clientAs(t.app, 'builder')
    const setCookie = async () => {
      const res = await c.get('/api/builds').expect(200)
      return res.headers['set-cookie'] ? String(res.headers['set-cookie']) : undefined
    }
    await setCookie() // the first request after sign-in starts the renewal clock
    const start = Date.now()
    vi.useFakeTimers({ toFake: ['Date'], now: start })
    expect(await setCookie()).toBeUndefined()
    vi.setSystemTime(start + 9 * 60_000)
    expect(await setCookie()).toBeUndefined()
    vi.setSystemTime(start + 11 * 60_000)
    const renewed = await setCookie()
    expect(renewed).toMatch(/binwright\.sid=/)
    // Expires is written to the second: 12 hours from this request, give or take one.
    expect(Math.abs(expiresOf(renewed!) - (start + 11 * 60_000 + 12 * 3600_000))).toBeLessThan(1500)
    expect(await setCookie()).toBeUndefined()
  })

  it('keeps a session alive past 12 hours of steady use and ends it 12 hours after the last request', async () => {
    const c = await clientAs(t.app, 'viewer')
    const start = Date.now()
    vi.useFakeTimers({ toFake: ['Date'], now: start })
    for (let hour = 1; hour <= 14; hour++) {
      vi.setSystemTime(start + hour * 3600_000)
      expect((await c.get('/api/auth/session')).body.user?.username).toBe('viewer')
    }
    vi.setSystemTime(start + 14 * 3600_000 + 12 * 3600_000 + 60_000)
    expect((await c.get('/api/auth/session')).body.user).toBeNull()
  })
})

describe('/api/users', () => {
  const newUser = { username: 'fitter2', displayName: 'A Fitter', role: 'builder', password: 'gland-nut-77' }

  it('answers 401 to a signed-out request', async () => {
    const c = await clientFor(t.app)
    const res = await c.get('/api/users')
    expect(res.status).toBe(401)
    expect(res.body.error.code).toBe('SIGN_IN_REQUIRED')
  })

  it('refuses a viewer creating a user with 403', async () => {
    const c = await clientAs(t.app, 'viewer')
    const res = await c.post('/api/users', newUser)
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('FORBIDDEN')
  })

  it('lets an admin create a user who can then sign in', async () => {
    const c = await clientAs(t.app, 'admin')
    const res = await c.post('/api/users', newUser)
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ username: 'fitter2', role: 'builder', active: true })
    expect(res.body).not.toHaveProperty('passwordHash')
    const fitter = await clientFor(t.app, 'fitter2', 'gland-nut-77')
    expect((await fitter.get('/api/auth/session')).body.user.role).toBe('builder')
  })

  it('refuses a body that breaks the schema with 400 naming each field', async () => {
    const c = await clientAs(t.app, 'admin')
    const res = await c.post('/api/users', { username: 'x', role: 'foreman', password: 'short' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('INVALID_INPUT')
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toEqual(expect.arrayContaining(['username', 'displayName', 'role', 'password']))
  })

  it('refuses malformed JSON with 400 MALFORMED_JSON', async () => {
    const c = await clientAs(t.app, 'admin')
    const res = await c.agent.post('/api/users').set('x-csrf-token', c.token)
      .set('content-type', 'application/json').send('{"username": "oops",')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('MALFORMED_JSON')
  })

  it('stops a deactivated user signing in', async () => {
    const admin = await clientAs(t.app, 'admin')
    const list = await admin.get('/api/users')
    const fitter = list.body.find((u: { username: string }) => u.username === 'fitter2')
    expect((await admin.patch(`/api/users/${fitter.id}`, { active: false })).body.active).toBe(false)
    await expect(clientFor(t.app, 'fitter2', 'gland-nut-77')).rejects.toThrow(/401/)
  })

  it('refuses a signed-in user on the very next request once deactivated', async () => {
    const admin = await clientAs(t.app, 'admin')
    const made = await admin.post('/api/users', { username: 'fitter3', displayName: 'B Fitter', role: 'builder', password: 'gland-nut-88' })
    const fitter = await clientFor(t.app, 'fitter3', 'gland-nut-88')
    // Two reads, so the user is in the server's sign-in cache before the change.
    expect((await fitter.get('/api/builds')).status).toBe(200)
    expect((await fitter.get('/api/auth/session')).body.user.username).toBe('fitter3')
    await admin.patch(`/api/users/${made.body.id}`, { active: false })
    const refused = await fitter.get('/api/builds')
    expect(refused.status).toBe(401)
    expect(refused.body.error.code).toBe('SIGN_IN_REQUIRED')
    expect((await fitter.get('/api/auth/session')).body.user).toBeNull()
  })

  it('applies a role change on the next request of a signed-in user', async () => {
    const admin = await clientAs(t.app, 'admin')
    const made = await admin.post('/api/users', { username: 'fitter4', displayName: 'C Fitter', role: 'viewer', password: 'gland-nut-99' })
    const fitter = await clientFor(t.app, 'fitter4', 'gland-nut-99')
    expect((await fitter.get('/api/auth/session')).body.user.role).toBe('viewer')
    await admin.patch(`/api/users/${made.body.id}`, { role: 'storekeeper' })
    expect((await fitter.get('/api/auth/session')).body.user.role).toBe('storekeeper')
  })
})

describe('POST /api/auth/password', () => {
  it('changes one\'s own password after checking the current one', async () => {
    const admin = await clientAs(t.app, 'admin')
    await admin.post('/api/users', { username: 'apprentice', displayName: 'Apprentice', role: 'viewer', password: 'first-pass-1' })
    const c = await clientFor(t.app, 'apprentice', 'first-pass-1')
    expect((await c.post('/api/auth/password', { currentPassword: 'wrong', newPassword: 'second-pass-2' })).status).toBe(400)
    expect((await c.post('/api/auth/password', { currentPassword: 'first-pass-1', newPassword: 'second-pass-2' })).status).toBe(204)
    await expect(clientFor(t.app, 'apprentice', 'second-pass-2')).resolves.toBeTruthy()
  })
})
