import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestApp, clientFor, clientAs, type Client } from '../helpers/app'
import { registeredRoutes, type RegisteredRoute } from '../helpers/routes'
import { routeSamples, type RouteSamples } from '../helpers/route-samples'
import { ROUTE_ACCESS, type AccessLevel } from '../../server/route-access'
import { ROLES, roleAtLeast, type Role } from '../../shared/types/api'

type App = Awaited<ReturnType<typeof createTestApp>>
type Caller = Role | 'signed-out'
const CALLERS: Caller[] = ['signed-out', ...ROLES]

/** Reads before writes, deletes last: a storekeeper's delete must not hide a later route's record. */
const METHOD_ORDER = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE']

let t: App
let routes: RegisteredRoute[]
let samples: RouteSamples
const clients = new Map<Caller, Client>()

beforeAll(async () => {
  t = await createTestApp({ demo: true })
  routes = registeredRoutes(t.app)
  samples = await routeSamples(t.dataSource)
  for (const c of CALLERS) clients.set(c, c === 'signed-out' ? await clientFor(t.app) : await clientAs(t.app, c))
})
afterAll(() => t?.close())

/** What a caller must get: 'in' = past the role check (any status but 401/403/5xx). */
function expected(caller: Caller, least: AccessLevel): 401 | 403 | 'in' {
  if (least === 'public') return 'in'
  if (caller === 'signed-out') return 401
  return roleAtLeast(caller, least) ? 'in' : 403
}

async function call(client: Client, route: RegisteredRoute, url: string) {
  switch (route.method) {
    case 'GET': return client.get(url)
    case 'POST': return client.post(url, {})
    case 'PUT': return client.put(url, {})
    case 'PATCH': return client.patch(url, {})
    case 'DELETE': return client.delete(url)
    default: throw new Error(`no caller for ${route.method}`)
  }
}

describe('role × route matrix (server/route-access.ts)', () => {
  it('finds the routers: more than a hundred routes under /api', () => {
    expect(routes.length).toBeGreaterThan(100)
    expect(routes.map((r) => r.key)).toContain('GET /api/parts/:id')
    expect(routes.map((r) => r.key)).toContain('POST /api/builds/:id/lines/:lineId'.replace('POST', 'PATCH'))
  })

  it('lists every registered route, and no route that is not registered', () => {
    const registered = routes.map((r) => r.key)
    expect(registered.filter((k) => !ROUTE_ACCESS[k]), 'routes with no entry in ROUTE_ACCESS').toEqual([])
    expect(Object.keys(ROUTE_ACCESS).filter((k) => !registered.includes(k)), 'entries with no route').toEqual([])
  })

  it('answers every route × caller as the table says', async () => {
    const ordered = [...routes].filter((r) => r.key !== 'POST /api/auth/logout')
      .sort((a, b) => METHOD_ORDER.indexOf(a.method) - METHOD_ORDER.indexOf(b.method))
    const wrong: string[] = []
    let checked = 0
    const statuses: Record<number, number> = {}
    for (const route of ordered) {
      const url = samples.fill(route.path)
      for (const caller of CALLERS) {
        const res = await call(clients.get(caller)!, route, url)
        const want = expected(caller, ROUTE_ACCESS[route.key].least)
        const ok = want === 'in' ? ![401, 403].includes(res.status) && res.status < 500 : res.status === want
        if (!ok) wrong.push(`${route.key} as ${caller}: ${res.status} (want ${want}) ${JSON.stringify(res.body?.error ?? '')}`)
        if (!ok || want !== 'in') expect(res.body?.error?.code, `${route.key} as ${caller} error shape`).toBeTypeOf('string')
        statuses[res.status] = (statuses[res.status] ?? 0) + 1
        checked++
      }
    }
    console.info(`route matrix: ${ordered.length} routes × ${CALLERS.length} callers = ${checked} requests checked`, statuses)
    expect(wrong).toEqual([])
    // Real demo ids: most allowed calls reach a record rather than a 404.
    const ok = Object.entries(statuses).filter(([s]) => Number(s) < 300).reduce((n, [, c]) => n + c, 0)
    expect(ok).toBeGreaterThan(120)
  }, 120_000)

  it('lets anyone sign out, and the session is gone after it', async () => {
    for (const caller of CALLERS) {
      const c = caller === 'signed-out' ? await clientFor(t.app) : await clientAs(t.app, caller)
      expect((await c.post('/api/auth/logout')).status).toBe(204)
      expect((await c.get('/api/parts')).status).toBe(401)
    }
  })

  it('refuses a builder changing a build they do not own (ownership beyond the role)', async () => {
    const builder = clients.get('builder')!
    const rows = await t.dataSource.query(
      `SELECT b.id FROM builds b JOIN users u ON u.id = b."ownerId" WHERE u.role <> 'builder' ORDER BY b.id`) as { id: number }[]
    expect(rows.length).toBeGreaterThan(0)
    const id = rows[0].id
    for (const [method, path] of [['PATCH', ''], ['POST', '/status'], ['POST', '/lines'], ['POST', '/reserve'], ['POST', '/release'], ['POST', '/draw']] as const) {
      const res = method === 'PATCH' ? await builder.patch(`/api/builds/${id}${path}`, { name: 'Mine now' }) : await builder.post(`/api/builds/${id}${path}`, {})
      expect([403, 400], `${method} /api/builds/:id${path}`).toContain(res.status)
    }
    const patch = await builder.patch(`/api/builds/${id}`, { name: 'Mine now' })
    expect(patch.status).toBe(403)
    expect(patch.body.error.code).toBe('FORBIDDEN')
  })
})
