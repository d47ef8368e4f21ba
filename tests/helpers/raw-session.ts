import { DEMO_USERS } from '../../seeds/demo-users'

/** What a raw POST answered. */
export interface RawResponse {
  status: number
  body: { error?: { code: string; message: string } } & Record<string, unknown>
}

/** A signed-in session on a listening server: its cookie and its CSRF token. */
export interface RawSession {
  cookie: string
  token: string
}

/** Signs in to a listening server over plain HTTP (fetch) as a demo user, as a browser would. */
export async function rawSession(base: string, username: string): Promise<RawSession> {
  const password = DEMO_USERS.find((u) => u.username === username)!.password
  const first = await fetch(`${base}/api/auth/session`)
  const cookie = first.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ')
  const { csrfToken } = await first.json() as { csrfToken: string }
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie },
    body: JSON.stringify({ username, password }),
  })
  if (login.status !== 200) throw new Error(`sign-in as ${username} answered ${login.status}`)
  const token = ((await login.json()) as { csrfToken: string }).csrfToken
  return { cookie: login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ') || cookie, token }
}

/** A poster for `session` that carries its cookie and CSRF token on every JSON POST. */
export function rawPoster(base: string, { cookie, token }: RawSession) {
  return async (path: string, body: object): Promise<RawResponse> => {
    const res = await fetch(base + path, {
      method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie }, body: JSON.stringify(body),
    })
    return { status: res.status, body: await res.json() }
  }
}

/** Signs in as a demo user and returns a poster carrying that session (rawSession + rawPoster). */
export async function signInRaw(base: string, username: string) {
  return rawPoster(base, await rawSession(base, username))
}
