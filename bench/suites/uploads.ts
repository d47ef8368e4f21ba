import { percentile, record } from '../harness'
import { clientAs, createTestApp, type Client } from '../../tests/helpers/app'
import { jpegBytes } from '../../tests/helpers/images'
import { Part } from '../../server/entities'
import { thumbnailPool } from '../../server/services/attachments'

/** A 12 MP phone photo, as the issue sets the goal for (4000×3000). */
const PHOTO_W = 4000
const PHOTO_H = 3000
/** Uploads measured; each waits for its thumbnails before the next, as one user would. */
const RUNS = 3
/** Goal from the issue: the upload is answered quickly, the thumbnails follow. */
const RESPONSE_GOAL_MS = 1500
/** Thumbnails taking longer than this are reported as not made. */
const THUMB_TIMEOUT_MS = 120_000

async function untilThumbnails(c: Client, id: number) {
  const until = Date.now() + THUMB_TIMEOUT_MS
  const healthMs: number[] = []
  for (;;) {
    // Health checks while the worker is busy show whether requests still get a turn.
    const t0 = performance.now()
    await c.get('/api/health')
    healthMs.push(performance.now() - t0)
    const a = (await c.get(`/api/attachments/${id}`)).body
    if (a.thumbStatus !== 'pending' || Date.now() > until) return { status: a.thumbStatus as string, healthMs }
    await new Promise((r) => setTimeout(r, 50))
  }
}

export const uploadsSuite = {
  name: `uploads: a ${PHOTO_W}×${PHOTO_H} JPEG, thumbnails made off the request path`,
  async run() {
    const t = await createTestApp()
    try {
      const part = await t.dataSource.getRepository(Part).save({
        code: 'BENCH-PHOTO', name: 'Bench photo holder', kind: 'other', attributes: {}, labelCode: 'P-BENCH-PHOTO',
      })
      const keeper = await clientAs(t.app, 'storekeeper')
      const photo = await jpegBytes(PHOTO_W, PHOTO_H, true, 90)
      console.log(`  photo: ${(photo.length / 1024 / 1024).toFixed(1)} MB`)
      const responseMs: number[] = []
      const thumbsMs: number[] = []
      const healthMs: number[] = []
      for (let i = 0; i < RUNS; i++) {
        const t0 = performance.now()
        const res = await keeper.agent.post(`/api/attachments?ownerType=part&ownerId=${part.id}`)
          .set('x-csrf-token', keeper.token).attach('file', photo, `photo-${i}.jpg`)
        responseMs.push(performance.now() - t0)
        if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${JSON.stringify(res.body)}`)
        const done = await untilThumbnails(keeper, res.body.id)
        if (done.status !== 'ready') throw new Error(`thumbnails ended ${done.status}`)
        thumbsMs.push(performance.now() - t0)
        healthMs.push(...done.healthMs)
      }
      const worst = Math.max(...responseMs)
      record({ figure: 'upload 4000×3000 JPEG: time to response (worst of 3)', value: worst, unit: 'ms',
        goal: `≤ ${RESPONSE_GOAL_MS} ms`, pass: worst <= RESPONSE_GOAL_MS })
      record({ figure: 'upload 4000×3000 JPEG: time to response (median)', value: percentile(responseMs, 50), unit: 'ms' })
      record({ figure: 'upload 4000×3000 JPEG: until 160 + 800 px thumbnails exist (median)', value: percentile(thumbsMs, 50), unit: 'ms' })
      record({ figure: 'GET /api/health while thumbnails are made (p95)', value: percentile(healthMs, 95), unit: 'ms' })
    } finally {
      await thumbnailPool.close()
      await t.close()
    }
  },
}
