import { DEMO_USERS } from '../../seeds/demo-users'

/** What a raw POST answered. */
export interface RawResponse {
  status: number
  body: { error?: { code: string; message: string } } & Record<string, unknown>
}

/**
 * Signs in to a listening server over plain HTTP (fetch) as a demo user and returns a poster
 * that carries the session cookie and the CSRF token, as a browser would.
 */
export async function signInRaw(base: string, username: string) {
  const password = DEMO_USERS.find((u) => u.username === username)!.password
  const first = await fetch(`${base}/api/auth/session`)
  let cookie = first.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ')
  const { csrfToken } = await first.json() as { csrfToken: string }
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie },
    body: JSON.stringify({ username, password }),
  })
  if (login.status !== 200) throw new Error(`sign-in as ${username} answered ${login.status}`)
  cookie = login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ') || cookie
  const token = ((await login.json()) as { csrfToken: string }).csrfToken
  return async (path: string, body: object): Promise<RawResponse> => {
    const res = await fetch(base + path, {
      method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie }, body: JSON.stringify(body),
    })
    return { status: res.status, body: await res.json() }
  }
}
