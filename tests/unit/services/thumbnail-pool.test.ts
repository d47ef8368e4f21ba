import { afterAll, describe, expect, it } from 'vitest'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { ThumbnailPool } from '../../../server/services/thumbnail-pool'
import { inspect, pngBytes } from '../../helpers/images'

const dir = mkdtempSync(join(tmpdir(), 'binwright-thumbs-'))
afterAll(() => rmSync(dir, { recursive: true, force: true }))

const job = (source: string, name: string) => ({
  source, mime: 'image/png',
  outputs: [160, 800].map((width) => ({ width, path: join(dir, `${name}-${width}.png`) })),
})

describe('ThumbnailPool (worker threads running a plain .mjs worker under vitest)', () => {
  it('makes both widths and reports the source size', async () => {
    const pool = new ThumbnailPool(1)
    const src = join(dir, 'a.png')
    writeFileSync(src, await pngBytes(1000, 500))
    const r = await pool.run(job(src, 'a'))
    expect(r).toMatchObject({ ok: true, width: 1000, height: 500 })
    expect(await inspect(readFileSync(join(dir, 'a-160.png')))).toMatchObject({ width: 160, height: 80 })
    expect(await inspect(readFileSync(join(dir, 'a-800.png')))).toMatchObject({ width: 800, height: 400 })
    await pool.close()
  })

  it('fails a job on a missing file with a reason, and the same worker takes the next job', async () => {
    const pool = new ThumbnailPool(1)
    const bad = await pool.run(job(join(dir, 'nope.png'), 'nope'))
    expect(bad.ok).toBe(false)
    if (!bad.ok) expect(bad.error).toMatch(/ENOENT/)
    const src = join(dir, 'b.png')
    writeFileSync(src, await pngBytes(300, 300))
    expect((await pool.run(job(src, 'b'))).ok).toBe(true)
    await pool.close()
  })

  it('queues more jobs than workers and finishes them all', async () => {
    const pool = new ThumbnailPool(1)
    const src = join(dir, 'c.png')
    writeFileSync(src, await pngBytes(400, 300))
    const runs = [1, 2, 3].map((i) => pool.run(job(src, `c${i}`)))
    expect(pool.pending).toBe(3)
    expect((await Promise.all(runs)).every((r) => r.ok)).toBe(true)
    expect(pool.pending).toBe(0)
    await pool.close()
  })

  it('answers queued jobs with a failure when closed, instead of leaving them hanging', async () => {
    const pool = new ThumbnailPool(1)
    const src = join(dir, 'd.png')
    writeFileSync(src, await pngBytes(400, 300))
    const first = pool.run(job(src, 'd1'))
    const second = pool.run(job(src, 'd2'))
    await pool.close()
    expect(await second).toEqual({ ok: false, error: 'The thumbnail pool was closed.' })
    expect((await first).ok).toBe(false)
  })
})
