import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { readdirSync } from 'node:fs'
import { join } from 'node:path'
import type { Express } from 'express'
import type { DataSource } from 'typeorm'
import { clientAs, clientFor, createTestApp, demoUser, type Client } from '../helpers/app'
import {
  WEBP_1X1, gifBytes, hugePngHeader, inspect, jpegBytes, pdfBytes, pngBytes, withExifOrientation,
} from '../helpers/images'
import { Attachment, Build, Part, User } from '../../server/entities'
import { hashPassword } from '../../server/services/users'
import { useDataSource } from '../../server/db'
import { thumbnailPool } from '../../server/services/attachments'
import type { AttachmentDto } from '../../shared/types/attachment'

let t: Awaited<ReturnType<typeof createTestApp>>
let app: Express
let keeper: Client, builder: Client, viewer: Client, otherBuilder: Client
let partId: number, ownBuildId: number, othersBuildId: number

async function seedOwners(ds: DataSource) {
  const part = await ds.getRepository(Part).save({
    code: 'NUT-7BA-BR', name: 'Nut 7BA brass', kind: 'fastener', attributes: { type: 'nut', thread: '7BA' }, labelCode: 'P-TEST-1',
  })
  const other = await ds.getRepository(User).save({
    username: 'ellis', displayName: 'Ellis Marsh', role: 'builder', email: null, active: true,
    passwordHash: await hashPassword('a-long-password-1'),
  })
  const builderId = (await ds.getRepository(User).findOneByOrFail({ username: demoUser('builder').username })).id
  const own = await ds.getRepository(Build).save({ name: 'Stuart No. 10', ownerId: builderId })
  const theirs = await ds.getRepository(Build).save({ name: 'Beam engine', ownerId: other.id })
  return { partId: part.id, ownBuildId: own.id, othersBuildId: theirs.id }
}

/** POST a file as multipart, with the session's CSRF token. */
const upload = (c: Client, owner: string, bytes: Buffer, name: string) =>
  c.agent.post(`/api/attachments?${owner}`).set('x-csrf-token', c.token).attach('file', bytes, name)

/** Polls until the worker has finished with an upload (or 20 s pass). */
async function settled(c: Client, id: number): Promise<AttachmentDto> {
  const until = Date.now() + 20_000
  for (;;) {
    const a = (await c.get(`/api/attachments/${id}`).expect(200)).body as AttachmentDto
    if (a.thumbStatus !== 'pending' || Date.now() > until) return a
    await new Promise((r) => setTimeout(r, 100))
  }
}

const bytesOf = async (c: Client, url: string) =>
  (await c.get(url).buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = []
    res.on('data', (d: Buffer) => chunks.push(d))
    res.on('end', () => cb(null, Buffer.concat(chunks)))
  }).expect(200)).body as Buffer

const storedFiles = () => {
  const dir = t.config.UPLOAD_DIR
  return [...readdirSync(dir).filter((f) => f !== 'thumbs'), ...readdirSync(join(dir, 'thumbs'))]
}

beforeAll(async () => {
  t = await createTestApp()
  app = t.app
  ;({ partId, ownBuildId, othersBuildId } = await seedOwners(t.dataSource))
  keeper = await clientAs(app, 'storekeeper')
  builder = await clientAs(app, 'builder')
  viewer = await clientAs(app, 'viewer')
  otherBuilder = await clientFor(app, 'ellis', 'a-long-password-1')
})
afterAll(() => t.close())

describe('POST /api/attachments with images', () => {
  it('answers 201 at once with the thumbnails pending, then makes them 160 and 800 px wide', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await pngBytes(1200, 900), 'cover.png')
      .expect(201)
    expect(res.body).toMatchObject({
      ownerType: 'part', ownerId: partId, originalName: 'cover.png', mime: 'image/png', kind: 'image',
      thumbStatus: 'pending', thumbUrls: null, uploadedByName: demoUser('storekeeper').displayName,
    })
    const done = await settled(keeper, res.body.id)
    expect(done.thumbStatus).toBe('ready')
    const small = await inspect(await bytesOf(keeper, done.thumbUrls![160]))
    const large = await inspect(await bytesOf(keeper, done.thumbUrls![800]))
    // 1200×900 keeps its 4:3 shape: 160×120 and 800×600.
    expect([small.width, small.height]).toEqual([160, 120])
    expect([large.width, large.height]).toEqual([800, 600])
    const original = await inspect(await bytesOf(keeper, done.fileUrl))
    expect([original.width, original.height]).toEqual([1200, 900])
  })

  it('turns a JPEG by its EXIF orientation tag (6: rotate 90° clockwise) before scaling', async () => {
    const tagged = withExifOrientation(await jpegBytes(1200, 900), 6)
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, tagged, 'phone.jpg').expect(201)
    const done = await settled(keeper, res.body.id)
    expect(done.thumbStatus).toBe('ready')
    // Stored 1200×900 landscape; shown 900×1200 portrait, so 800 wide is 800×1067.
    const large = await inspect(await bytesOf(keeper, done.thumbUrls![800]), [[790, 10], [10, 10]])
    expect(large.width).toBe(800)
    expect(large.height).toBeGreaterThanOrEqual(1066)
    expect(large.height).toBeLessThanOrEqual(1067)
    // The red top-left corner moves to the top-right when turned clockwise.
    const [topRight] = large.colours
    expect(channel(topRight, 0)).toBeGreaterThan(200)
    expect(channel(topRight, 2)).toBeLessThan(60)
  })

  it('never enlarges an image narrower than a thumbnail (both stay at its own width)', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await gifBytes(100, 80), 'tiny.gif')
      .expect(201)
    const done = await settled(keeper, res.body.id)
    expect(done.thumbStatus).toBe('ready')
    for (const w of [160, 800] as const) {
      const thumb = await inspect(await bytesOf(keeper, done.thumbUrls![w]))
      expect([thumb.width, thumb.height]).toEqual([100, 80])
    }
  })
})

/** One RGBA channel of a jimp colour (0 red, 1 green, 2 blue). */
const channel = (rgba: number, i: number) => (rgba >>> (24 - 8 * i)) & 0xff

describe('serving images', () => {
  it('serves images inline with their judged type, nosniff, private caching and a sandboxing CSP', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await pngBytes(64, 48), 'gland.png')
      .expect(201)
    const file = await keeper.get(res.body.fileUrl).expect(200)
    expect(file.headers).toMatchObject({
      'content-type': 'image/png',
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, max-age=86400',
    })
    expect(file.headers['content-disposition']).toMatch(/^inline; filename="gland\.png"/)
    expect(file.headers['content-security-policy']).toMatch(/default-src 'none'.*sandbox/)
    const done = await settled(keeper, res.body.id)
    const thumb = await keeper.get(done.thumbUrls![160]).expect(200)
    expect(thumb.headers['content-type']).toBe('image/png')
    expect(thumb.headers['x-content-type-options']).toBe('nosniff')
  })

  it('keeps a WebP without thumbnails (jimp 1.6 cannot decode WebP) and serves it as it came', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, WEBP_1X1, 'dot.webp').expect(201)
    expect(res.body).toMatchObject({ mime: 'image/webp', kind: 'image', thumbStatus: 'none', thumbUrls: null })
    const file = await keeper.get(res.body.fileUrl).expect(200)
    expect(file.headers['content-type']).toBe('image/webp')
  })

  it('answers 404 NO_THUMBNAIL while pending and 400 for a width that is not made', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await pngBytes(1200, 900), 'big.png')
      .expect(201)
    const early = await keeper.get(`/api/attachments/${res.body.id}/thumb/160`)
    if (early.status === 404) expect(early.body.error.message).toMatch(/still being made/)
    await keeper.get(`/api/attachments/${res.body.id}/thumb/320`).expect(400)
    await settled(keeper, res.body.id)
  })
})

describe('POST /api/attachments with PDF drawings', () => {
  it('keeps a PDF as it came, with no thumbnail, served as a download that cannot be sniffed', async () => {
    const pdf = await pdfBytes()
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, pdf, 'steam chest.pdf').expect(201)
    expect(res.body).toMatchObject({ mime: 'application/pdf', kind: 'pdf', thumbStatus: 'none', sizeBytes: pdf.length })
    const file = await keeper.get(res.body.fileUrl).buffer(true).expect(200)
    expect(file.headers['content-type']).toBe('application/pdf')
    expect(file.headers['x-content-type-options']).toBe('nosniff')
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="steam chest\.pdf"/)
    expect(file.headers['cache-control']).toMatch(/^private/)
    expect(Buffer.compare(Buffer.from(file.body), pdf)).toBe(0)
    const thumb = await keeper.get(`/api/attachments/${res.body.id}/thumb/160`).expect(404)
    expect(thumb.body.error.code).toBe('NO_THUMBNAIL')
  })
})

describe('refusals by type and size', () => {
  const owner = () => `ownerType=part&ownerId=${partId}`

  it('refuses a text file renamed .png with 415, naming what is accepted', async () => {
    const res = await upload(keeper, owner(), Buffer.from('cut list: 3 × 7BA studs\n'), 'sketch.png').expect(415)
    expect(res.body.error.code).toBe('UNSUPPORTED_FILE_TYPE')
    expect(res.body.error.message).toMatch(/PNG, JPEG, WebP or GIF image, or a PDF/)
  })

  it('refuses an executable (ELF header) with 415 and says what it is', async () => {
    const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(120)])
    const res = await upload(keeper, owner(), elf, 'drawing.jpg').expect(415)
    expect(res.body.error.details.detected).toBe('application/x-elf')
  })

  it('refuses an SVG, which can carry scripts, with 415', async () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'
    await upload(keeper, owner(), Buffer.from(svg), 'valve.svg').expect(415)
  })

  it('refuses a file over UPLOAD_MAX_MB with 413 in the error shape, storing nothing', async () => {
    const small = await createTestApp({ config: { UPLOAD_MAX_MB: 0.05 } })
    try {
      const { partId: pid } = await seedOwners(small.dataSource)
      const c = await clientAs(small.app, 'storekeeper')
      const big = await jpegBytes(600, 400, true, 95)
      expect(big.length).toBeGreaterThan(0.05 * 1024 * 1024)
      const res = await upload(c, `ownerType=part&ownerId=${pid}`, big, 'photo.jpg').expect(413)
      expect(res.body.error).toMatchObject({ code: 'FILE_TOO_LARGE', details: { maxBytes: 52428 } })
      expect(res.body.error.message).toMatch(/limit of 0\.05 MB/)
      expect((await c.get('/api/attachments/rules').expect(200)).body.maxBytes).toBe(52428)
      expect(readdirSync(small.config.UPLOAD_DIR).filter((f) => f !== 'thumbs')).toEqual([])
    } finally {
      await small.close()
      // createTestApp points the services at its own database; point them back at this file's.
      useDataSource(t.dataSource)
    }
  })

  it('answers 400 when no file is sent, and 404 for a part that does not exist', async () => {
    const none = await keeper.post(`/api/attachments?${owner()}`).expect(400)
    expect(none.body.error.code).toBe('NO_FILE')
    const missing = await upload(keeper, 'ownerType=part&ownerId=99999', await pngBytes(20, 20), 'a.png').expect(404)
    expect(missing.body.error.message).toMatch(/part/)
    await upload(keeper, 'ownerType=bin&ownerId=1', await pngBytes(20, 20), 'a.png').expect(400)
  })
})

describe('broken images', () => {
  const owner = () => `ownerType=part&ownerId=${partId}`
  const count = async () => (await keeper.get(`/api/attachments?${owner()}`).expect(200)).body.total as number

  it('refuses a truncated JPEG with 422 and stores nothing', async () => {
    const before = await count()
    const whole = await jpegBytes(1200, 900, true)
    const cut = whole.subarray(0, Math.round(whole.length * 0.4))
    const res = await upload(keeper, owner(), cut, 'half.jpg').expect(422)
    expect(res.body.error).toMatchObject({ code: 'DAMAGED_IMAGE' })
    expect(res.body.error.message).toContain('cut short')
    expect(await count()).toBe(before)
    // The whole file goes in.
    expect((await upload(keeper, owner(), whole, 'whole.jpg').expect(201)).body.thumbStatus).toBe('pending')
  })

  it('refuses a PNG without its end chunk with 422', async () => {
    const png = await pngBytes(300, 200)
    const res = await upload(keeper, owner(), png.subarray(0, png.length - 12), 'cut.png').expect(422)
    expect(res.body.error.code).toBe('DAMAGED_IMAGE')
  })

  it('refuses a PNG whose header claims 100,000 × 100,000 pixels with 413 before decoding anything', async () => {
    const before = await count()
    const res = await upload(keeper, owner(), hugePngHeader(), 'bomb.png').expect(413)
    expect(res.body.error).toMatchObject({ code: 'IMAGE_TOO_LARGE', details: { width: 100_000, height: 100_000 } })
    expect(res.body.error.message).toContain('100,000 × 100,000 pixels')
    expect(await count()).toBe(before)
    await keeper.get('/api/health').expect(200)
  })

  it('marks a whole PNG with a corrupt body as failed, keeps the original, and carries on', async () => {
    const png = await pngBytes(300, 200)
    // Header and end chunk intact, the image data in between smudged: only decoding finds out.
    const broken = Buffer.concat([png.subarray(0, 40), Buffer.alloc(400, 0x55), png.subarray(-12)])
    const res = await upload(keeper, owner(), broken, 'smudged.png').expect(201)
    const done = await settled(keeper, res.body.id)
    expect(done.thumbStatus).toBe('failed')
    expect(done.thumbUrls).toBeNull()
    await keeper.get(done.fileUrl).expect(200)
    const next = await upload(keeper, owner(), await pngBytes(200, 100), 'fine.png').expect(201)
    expect((await settled(keeper, next.body.id)).thumbStatus).toBe('ready')
  })
})

describe('who may upload, read and delete', () => {
  it('lets a viewer list and open drawings but not upload (403)', async () => {
    const list = await viewer.get(`/api/attachments?ownerType=part&ownerId=${partId}`).expect(200)
    expect(list.body.total).toBeGreaterThan(0)
    expect(list.body.items[0]).toHaveProperty('fileUrl')
    await viewer.get(list.body.items[0].fileUrl).expect(200)
    const res = await upload(viewer, `ownerType=part&ownerId=${partId}`, await pngBytes(20, 20), 'v.png').expect(403)
    expect(res.body.error.code).toBe('FORBIDDEN')
  })

  it('answers a large upload refused before its body is read with the status, not a dropped connection', async () => {
    const big = Buffer.concat([await pngBytes(20, 20), Buffer.alloc(4 * 1024 * 1024)])
    const res = await upload(viewer, `ownerType=part&ownerId=${partId}`, big, 'big.png').expect(403)
    expect(res.body.error.code).toBe('FORBIDDEN')
    await upload(keeper, 'ownerType=part&ownerId=99999', big, 'big.png').expect(404)
  })

  it("keeps a builder off a part's drawings and off another builder's build (403)", async () => {
    await upload(builder, `ownerType=part&ownerId=${partId}`, await pngBytes(20, 20), 'b.png').expect(403)
    const res = await upload(builder, `ownerType=build&ownerId=${othersBuildId}`, await pngBytes(20, 20), 'b.png')
      .expect(403)
    expect(res.body.error.message).toMatch(/owner/)
  })

  it('lets a builder upload to their own build, and a storekeeper to anyone\'s', async () => {
    const own = await upload(builder, `ownerType=build&ownerId=${ownBuildId}`, await pngBytes(40, 30), 'mine.png')
      .expect(201)
    expect(own.body).toMatchObject({ ownerType: 'build', ownerId: ownBuildId })
    await upload(keeper, `ownerType=build&ownerId=${othersBuildId}`, await pngBytes(40, 30), 'k.png').expect(201)
    await otherBuilder.delete(`/api/attachments/${own.body.id}`).expect(403)
  })

  it('keeps only a safe display name: no folders, no control characters, UTF-8 intact', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await pngBytes(20, 20),
      '../../etc/Zylinder\u202edeckel ü.png').expect(201)
    expect(res.body.originalName).toBe('Zylinderdeckel ü.png')
  })
})

describe('DELETE /api/attachments/:id', () => {
  it('removes the row, the original and both thumbnails from disk', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await pngBytes(900, 600), 'gone.png')
      .expect(201)
    await settled(keeper, res.body.id)
    const row = await t.dataSource.getRepository(Attachment).findOneByOrFail({ id: res.body.id })
    const stem = row.storedName.replace(/\.png$/, '')
    const mine = () => storedFiles().filter((f) => f.startsWith(stem)).sort()
    expect(mine()).toEqual([`${stem}-160.png`, `${stem}-800.png`, `${stem}.png`])
    expect(row.storedName).toMatch(/^[0-9a-f]{32}\.png$/)
    await keeper.delete(`/api/attachments/${res.body.id}`).expect(204)
    expect(mine()).toEqual([])
    await keeper.get(`/api/attachments/${res.body.id}`).expect(404)
    await keeper.get(res.body.fileUrl).expect(404)
  })

  it('also removes thumbnails that a worker finishes after the delete', async () => {
    const res = await upload(keeper, `ownerType=part&ownerId=${partId}`, await pngBytes(1200, 900), 'quick.png')
      .expect(201)
    const row = await t.dataSource.getRepository(Attachment).findOneByOrFail({ id: res.body.id })
    await keeper.delete(`/api/attachments/${res.body.id}`).expect(204)
    const stem = row.storedName.replace(/\.png$/, '')
    const leftovers = () => storedFiles().filter((f) => f.startsWith(stem))
    // Wait for the worker, then (briefly) for its result to be recorded and the orphans removed.
    const until = Date.now() + 20_000
    while ((thumbnailPool.pending > 0 || leftovers().length) && Date.now() < until) {
      await new Promise((r) => setTimeout(r, 100))
    }
    expect(leftovers()).toEqual([])
  })

  it("lets a builder delete their own build's drawing, but not a viewer (403)", async () => {
    const res = await upload(builder, `ownerType=build&ownerId=${ownBuildId}`, await pngBytes(40, 30), 'x.png')
      .expect(201)
    await viewer.delete(`/api/attachments/${res.body.id}`).expect(403)
    await builder.delete(`/api/attachments/${res.body.id}`).expect(204)
    const list = await builder.get(`/api/attachments?ownerType=build&ownerId=${ownBuildId}`).expect(200)
    expect(list.body.items.map((a: AttachmentDto) => a.id)).not.toContain(res.body.id)
  })
})
