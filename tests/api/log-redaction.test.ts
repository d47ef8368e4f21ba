import { afterAll, beforeAll, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../helpers/server'
import { signInRaw } from '../helpers/raw-session'

let server: RunningServer
beforeAll(async () => {
  server = await startServer({ LOG_LEVEL: 'info' })
}, 60_000)
afterAll(() => server?.stop())

it('logs each API request without the session cookie or the form token', async () => {
  const session = await fetch(`${server.url}/api/auth/session`)
  const cookie = session.headers.getSetCookie()[0].split(';')[0]
  const { csrfToken } = await session.json() as { csrfToken: string }
  await fetch(`${server.url}/api/auth/session`, { headers: { cookie, 'x-csrf-token': csrfToken } })
  const post = await signInRaw(server.url, 'builder')
  await post('/api/builds', { name: 'Logged build' })
  await new Promise((r) => setTimeout(r, 300)) // let the child's log lines arrive
  const log = server.output()
  expect(log).toContain('"url":"/api/builds"')
  expect(log).toContain('[kept out of the log]')
  expect(log).not.toContain(cookie.split('=')[1])
  expect(log).not.toContain(csrfToken)
  expect(log).not.toMatch(/binwright\.sid=[^;"[]/)
})
