import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import type { Response } from 'supertest'
import { createTestApp, clientAs, type Client } from '../helpers/app'
import { databaseDigest } from '../helpers/db-digest'
import { hugePngHeader, jpegBytes, pngBytes } from '../helpers/images'
import { MAX_QUANTITY } from '../../shared/schemas/stock'

type App = Awaited<ReturnType<typeof createTestApp>>
let t: App
let admin: Client
let ids: { part: number; countedPart: number; bin: number; rack: number; workshop: number; build: number; line: number; supplier: number }
let before: string
let tried = 0
/** Fixed seed: a failure prints its seed and path, and reruns the same way. */
const RUN = { seed: 20_240_601, numRuns: 40 }

beforeAll(async () => {
  t = await createTestApp({ demo: true })
  admin = await clientAs(t.app, 'admin')
  const one = async (sql: string) => Number(Object.values((await t.dataSource.query(sql))[0])[0])
  ids = {
    part: await one('SELECT id FROM parts ORDER BY id'),
    countedPart: await one("SELECT id FROM parts WHERE kind = 'fastener' ORDER BY id"),
    bin: await one('SELECT id FROM bins WHERE retired = false ORDER BY id'),
    rack: await one('SELECT id FROM racks ORDER BY id'),
    workshop: await one('SELECT id FROM workshops ORDER BY id'),
    build: await one(`SELECT b.id FROM builds b JOIN users u ON u.id = b."ownerId" WHERE u.role = 'builder' ORDER BY b.id`),
    line: await one(`SELECT l.id FROM build_lines l JOIN builds b ON b.id = l."buildId" JOIN users u ON u.id = b."ownerId" WHERE u.role = 'builder' ORDER BY l.id`),
    supplier: await one('SELECT id FROM suppliers ORDER BY id'),
  }
  before = await databaseDigest(t.dataSource)
})
afterAll(() => t?.close())

/** A refusal: 4xx in the one error shape. */
function refused(res: Response, what: string) {
  tried++
  expect(res.status, `${what}: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`).toBeGreaterThanOrEqual(400)
  expect(res.status, what).toBeLessThan(500)
  expect(res.body?.error?.code, `${what} error shape`).toBeTypeOf('string')
  expect(res.body.error.message, what).toBeTypeOf('string')
}

/** Values no positive whole-number id may take. */
const badId = fc.oneof(
  fc.constantFrom(0, -1, 1.5, -0.0001, 2 ** 53, 1e308, Number.MAX_VALUE, null, true, false, '', '1', '１', '1\u0000', '\u202E1',
    '1\u200B', '../1', '%2e%2e', '0x10', '1e3', [], [1], {}, { id: 1 }),
  fc.integer({ max: 0 }), fc.double({ noNaN: true }).filter((n) => !Number.isInteger(n)),
  fc.string(), fc.array(fc.nat(), { minLength: 1, maxLength: 3 }),
)
/** Anything JSON, for the fields left alone and the extra ones. */
const junk = fc.dictionary(fc.string({ maxLength: 12 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 })

/** Routes and the required id field that will carry the bad value; other fields valid. */
const withIdField = () => [
  { url: '/api/stock/receive', field: 'partId', body: { binId: ids.bin, quantity: 3 } },
  { url: '/api/stock/receive', field: 'binId', body: { partId: ids.part, quantity: 3 } },
  { url: '/api/stock/take', field: 'partId', body: { binId: ids.bin, quantity: 1 } },
  { url: '/api/stock/return', field: 'binId', body: { partId: ids.part, quantity: 1 } },
  { url: '/api/stock/move', field: 'toBinId', body: { partId: ids.part, fromBinId: ids.bin, quantity: 1 } },
  { url: '/api/stock/count', field: 'binId', body: { lines: [{ partId: ids.part, counted: 1 }] } },
  { url: '/api/bins', field: 'rackId', body: { code: 'Z9-99' } },
  { url: '/api/racks', field: 'workshopId', body: { code: 'Z9', name: 'Hostile rack' } },
  { url: `/api/builds/${ids.build}/lines`, field: 'partId', body: { quantity: 2 } },
  { url: `/api/builds/${ids.build}/draw`, field: 'lineId', body: { quantity: 1 } },
  { url: `/api/builds/${ids.build}/lines/copy`, field: 'fromBuildId', body: {} },
  { url: '/api/orders', field: 'supplierId', body: { lines: [{ partId: ids.part, quantity: 1 }] } },
]

/** Values no stock quantity may take (counted parts are whole numbers, every quantity above 0). */
const badQuantity = fc.oneof(
  fc.constantFrom(0, -1, -0.5, MAX_QUANTITY + 1, 1e308, Number.MAX_VALUE, '3', '３', '3\u0000', null, [], {}, true),
  fc.integer({ max: 0 }), fc.double({ min: MAX_QUANTITY * 2, noNaN: true, noDefaultInfinity: true }),
)

describe('hostile input: refused with 4xx, the database unchanged', () => {
  it('refuses a bad id in any stock, place, build or order request, whatever else comes with it', async () => {
    await fc.assert(fc.asyncProperty(fc.constantFrom(...withIdField()), badId, junk, async (route, bad, extra) => {
      refused(await admin.post(route.url, { ...extra, ...route.body, [route.field]: bad }), `${route.url} ${route.field}=${JSON.stringify(bad)}`)
    }), { ...RUN, numRuns: 80 })
  })

  it('refuses bad quantities, and fractions of counted parts', async () => {
    await fc.assert(fc.asyncProperty(badQuantity, fc.constantFrom('receive', 'take', 'return'), async (q, kind) => {
      refused(await admin.post(`/api/stock/${kind}`, { partId: ids.countedPart, binId: ids.bin, quantity: q }), `${kind} quantity=${JSON.stringify(q)}`)
    }), RUN)
    for (const q of [0.5, 2.25, 1 / 3]) {
      refused(await admin.post('/api/stock/receive', { partId: ids.countedPart, binId: ids.bin, quantity: q }), `counted part ×${q}`)
    }
  })

  it('refuses over-long, empty and trick text in names and codes', async () => {
    const badText = fc.oneof(
      fc.constantFrom('', '   ', 'x'.repeat(10_001), '\u202Eevil', 'A1\u0000', '\u200B\u200B', 'A1\u0008'),
      fc.string({ minLength: 5_000, maxLength: 6_000 }),
    )
    const routes = [
      { url: '/api/bins', field: 'code', body: { rackId: ids.rack } },
      { url: '/api/racks', field: 'code', body: { name: 'R', workshopId: ids.workshop } },
      { url: '/api/workshops', field: 'name', body: {} },
      { url: '/api/builds', field: 'name', body: {} },
      { url: '/api/suppliers', field: 'name', body: {} },
      { url: '/api/users', field: 'username', body: { displayName: 'Hostile', role: 'viewer', password: 'a-long-enough-pass-1' } },
    ]
    await fc.assert(fc.asyncProperty(fc.constantFrom(...routes), badText, async (route, bad) => {
      refused(await admin.post(route.url, { ...route.body, [route.field]: bad }), `${route.url} ${route.field}=${JSON.stringify(bad).slice(0, 40)}`)
    }), RUN)
    // A name may read "../../etc" (it is only text); a code may not.
    for (const code of ['../../etc', 'A1-03/../..', '%2e%2e', 'A1 03', '<b>A1</b>']) {
      refused(await admin.post('/api/bins', { code, rackId: ids.rack }), `bin code ${code}`)
      refused(await admin.post('/api/racks', { code, name: 'R', workshopId: ids.workshop }), `rack code ${code}`)
    }
  })

  it('refuses path tricks and junk in ids in the URL', async () => {
    const trick = fc.constantFrom('..', '..%2f..%2fpackage.json', '%2e%2e', '%2e%2e%2f%2e%2e', '-1', '0', '1.5', '1e3', '0x1f',
      '99999999999999999999999', '%00', '1%00', 'null', '%E2%80%AE1', '%20', "1'%20OR%201=1")
    const paths = ['/api/parts/:x', '/api/bins/:x', '/api/builds/:x', '/api/attachments/:x/file', '/api/attachments/:x/thumb/160',
      '/api/orders/:x', '/api/suppliers/:x', '/api/parts/by-label/:x', '/api/today/:x', '/api/outbox/:x']
    await fc.assert(fc.asyncProperty(fc.constantFrom(...paths), trick, async (path, x) => {
      refused(await admin.get(path.replace(':x', x)), `GET ${path} with ${x}`)
    }), RUN)
    for (const x of ['..', '%2e%2e', '-1', '1.5']) {
      refused(await admin.post(`/api/movements/${x}/reverse`, {}), `reverse ${x}`)
      refused(await admin.patch(`/api/parts/${x}`, { name: 'x' }), `patch part ${x}`)
    }
  })

  it('refuses wrong content types, broken JSON and bodies that are not objects', async () => {
    const raw = (type: string, body: string) => admin.agent.post('/api/stock/receive').set('x-csrf-token', admin.token).set('content-type', type).send(body)
    const valid = JSON.stringify({ partId: ids.countedPart, binId: ids.bin, quantity: 1 })
    for (const [type, body] of [
      ['text/plain', valid], ['application/xml', '<receive/>'], ['application/x-www-form-urlencoded', 'partId=1&binId=1&quantity=1'],
      ['application/json', '{"partId": 1, "binId": '], ['application/json', '[1,2,3]'], ['application/json', 'null'],
      ['application/json', '"a string"'], ['application/json', '{"__proto__": {"isAdmin": true}}'],
      ['application/json', `{"partId":${'['.repeat(5000)}`], ['multipart/form-data; boundary=x', '--x--'],
    ] as const) refused(await raw(type, body), `receive as ${type}: ${body.slice(0, 30)}`)
    const big = JSON.stringify({ partId: 1, binId: 1, quantity: 1, reason: 'x'.repeat(1_100_000) })
    refused(await raw('application/json', big), 'a body over the 1 MB limit')
  })

  it('refuses SVG with script, non-images, bomb-like and truncated images, whatever their names claim', async () => {
    const files: [Buffer, string][] = [
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'drawing.svg'],
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'), 'drawing.png'],
      [Buffer.from('<!doctype html><script>alert(1)</script>'), '../../../server/app.png'],
      [Buffer.from('#!/bin/sh\nrm -rf /\n'), '..%2f..%2frun.jpg'],
      [Buffer.from('PK\u0003\u0004not really a zip'), 'bomb.png'],
      [Buffer.alloc(0), 'empty.png'],
      [Buffer.from('\u0000\u0000\u0000'), 'nul\u0000.png'],
      // Decompression-bomb-like: a tiny PNG whose header claims 100,000 × 100,000 pixels.
      [hugePngHeader(), 'bomb.png'],
      // Truncated images: cut short in transfer, no end marker.
      [(await jpegBytes(400, 300)).subarray(0, 900), 'half.jpg'],
      [(await pngBytes(200, 100)).subarray(0, 120), 'half.png'],
    ]
    for (const [bytes, name] of files) {
      const res = await admin.agent.post(`/api/attachments?ownerType=part&ownerId=${ids.part}`).set('x-csrf-token', admin.token)
        .attach('file', bytes, { filename: name, contentType: 'image/png' })
      refused(res, `upload ${name}`)
    }
    refused(await admin.agent.post(`/api/attachments?ownerType=part&ownerId=${ids.part}`).set('x-csrf-token', admin.token)
      .set('content-type', 'application/json').send('{"file":"iVBORw0KGgo="}'), 'upload as JSON')
    refused(await admin.agent.post('/api/attachments?ownerType=../../etc&ownerId=1').set('x-csrf-token', admin.token)
      .attach('file', Buffer.from('x'), 'x.png'), 'upload with a bad owner')
  })

  it('left the database exactly as it was', async () => {
    expect(await databaseDigest(t.dataSource)).toBe(before)
    console.info(`hostile input: ${tried} malformed requests refused, database digest unchanged`)
    expect(tried).toBeGreaterThanOrEqual(100)
  })
})
