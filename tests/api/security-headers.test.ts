import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestApp, clientAs, type Client } from '../helpers/app'
import { registeredRoutes } from '../helpers/routes'
import { routeSamples } from '../helpers/route-samples'
import { pngBytes } from '../helpers/images'

let t: Awaited<ReturnType<typeof createTestApp>>
let admin: Client
beforeAll(async () => {
  t = await createTestApp({ demo: true })
  admin = await clientAs(t.app, 'admin')
})
afterAll(() => t?.close())

describe('CSRF on every state-changing route', () => {
  it('refuses every non-GET route without the form token with 403 CSRF_TOKEN, even for an admin', async () => {
    const samples = await routeSamples(t.dataSource)
    const changing = registeredRoutes(t.app).filter((r) => r.method !== 'GET')
    expect(changing.length).toBeGreaterThan(60)
    const wrong: string[] = []
    for (const r of changing) {
      const url = samples.fill(r.path)
      const call = r.method === 'POST' ? admin.agent.post(url) : r.method === 'PUT' ? admin.agent.put(url)
        : r.method === 'PATCH' ? admin.agent.patch(url) : admin.agent.delete(url)
      const res = await call.set('x-csrf-token', 'not-the-token').send({})
      if (res.status !== 403 || res.body?.error?.code !== 'CSRF_TOKEN') wrong.push(`${r.key}: ${res.status} ${res.body?.error?.code}`)
    }
    console.info(`csrf: ${changing.length} state-changing routes refused without the token`)
    expect(wrong).toEqual([])
  })
})

describe('headers', () => {
  it('sends a CSP whose script-src has no unsafe-inline or unsafe-eval', async () => {
    const res = await admin.get('/api/health')
    const csp = res.headers['content-security-policy']
    const scriptSrc = csp.split(';').map((d: string) => d.trim()).find((d: string) => d.startsWith('script-src'))
    expect(scriptSrc).toBe("script-src 'self'")
    expect(csp).toContain("object-src 'none'")
    expect(csp).toContain("frame-ancestors 'self'")
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['x-powered-by']).toBeUndefined()
  })

  it('serves an uploaded drawing with nosniff, a sandboxing CSP and a safe Content-Disposition', async () => {
    const partId = (await t.dataSource.query('SELECT id FROM parts ORDER BY id'))[0].id
    const up = await admin.agent.post(`/api/attachments?ownerType=part&ownerId=${partId}`).set('x-csrf-token', admin.token)
      .attach('file', await pngBytes(8, 8), { filename: 'valve "chest";\u202Egnp.exe.png', contentType: 'image/png' })
    expect(up.status).toBe(201)
    const res = await admin.get(`/api/attachments/${up.body.id}/file`)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('image/png')
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(res.headers['content-security-policy']).toMatch(/sandbox|default-src 'none'/)
    const disposition: string = res.headers['content-disposition']
    // One quoted printable-ASCII name with no quote or backslash inside, then the percent-encoded UTF-8 one.
    expect(disposition).toMatch(/^inline; filename="[\x20\x21\x23-\x5b\x5d-\x7e]+"; filename\*=UTF-8''[A-Za-z0-9%._~!$&+=:@-]+$/)
    expect(disposition).not.toContain('\u202E')
  })
})
