/**
 * GET /api/bins/:code, the read a scanned label makes, on the demo workshop: latency p50/p95
 * signed in through the whole middleware stack, beside the bare Express route of the same run.
 * Also checks that the server gzips the built client's JS (compression of static files).
 */
import { readdirSync } from 'node:fs'
import { percentile, record } from '../harness'
import { latencies, listenLocally } from './baseline'
import { createTestApp } from '../../tests/helpers/app'
import { rawSession } from '../../tests/helpers/raw-session'
import { Bin } from '../../server/entities'

/** The goal for the bin read after a scan. */
const P95_GOAL_MS = 5
const SAMPLES = 600

export const binsSuite = {
  name: 'bin read after a scan: GET /api/bins/:code on the demo workshop',
  async run() {
    const clientDir = process.env.CLIENT_DIR ?? 'dist/client'
    const t = await createTestApp({ demo: true, config: { CLIENT_DIR: clientDir } })
    const server = await listenLocally(t.app)
    const base = server.url
    try {
      const headers = { cookie: (await rawSession(base, 'builder')).cookie }
      const bins = (await t.dataSource.getRepository(Bin).find({ where: { retired: false } })).slice(0, 20)
      // By human code and by label code, as the scan page and a phone camera ask.
      const paths = bins.flatMap((b) => [`/api/bins/${b.code}`, `/api/bins/${b.labelCode}`])
      for (const p of paths) {
        const res = await fetch(base + p, { headers })
        if (!res.ok) throw new Error(`${p} answered ${res.status}`)
      }
      const samples: number[] = []
      for (let i = 0; samples.length < SAMPLES; i++) samples.push(...await latencies(base, paths[i % paths.length], 1, { headers }))
      const p95 = percentile(samples, 95)
      record({ figure: 'GET /api/bins/:code p50', value: percentile(samples, 50), unit: 'ms' })
      record({ figure: 'GET /api/bins/:code p95', value: p95, unit: 'ms', goal: `≤ ${P95_GOAL_MS} ms`, pass: p95 <= P95_GOAL_MS })
      const health = await latencies(base, '/api/health', SAMPLES / 2, { headers })
      record({ figure: 'GET /api/health signed in, same app, p95 (the floor)', value: percentile(health, 95), unit: 'ms' })
      const js = readdirSync(`${clientDir}/assets`).find((f) => f.startsWith('index-') && f.endsWith('.js'))
      if (js) {
        const res = await fetch(`${base}/assets/${js}`, { headers: { 'accept-encoding': 'gzip' } })
        await res.arrayBuffer()
        const gz = res.headers.get('content-encoding') === 'gzip'
        const immutable = /immutable/.test(res.headers.get('cache-control') ?? '')
        record({ figure: 'entry JS served gzip-compressed and cached as immutable', value: gz && immutable ? 1 : 0, unit: 'yes=1', goal: '= 1', pass: gz && immutable })
      }
    } finally {
      await server.close()
      await t.close()
    }
  },
}
