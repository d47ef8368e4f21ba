import { percentile, record } from '../harness'
import { clientAs, createTestApp } from '../../tests/helpers/app'
import { startServer } from '../../tests/helpers/server'
import { PHONE, launchBrowser, signIn } from '../../tests/helpers/browser'
import { Bin, Rack, Workshop } from '../../server/entities'
import { newLabelCode } from '../../server/services/codes'
import type { Page } from 'playwright-core'

/** Labels in the goal: ten A4 sheets of 24. */
const LABELS = 240
/** Timed runs after one warm-up (the first run also loads fonts and compiles code). */
const RUNS = 5
/** The goals: a 240-label PDF and a usable bin page, each within a second. */
const GOAL_MS = 1000

async function labelPdfTimes() {
  const t = await createTestApp({ demo: true })
  try {
    const keeper = await clientAs(t.app, 'storekeeper')
    // 240 distinct bins, so every label has its own QR code to encode (no copies).
    const rack = await t.dataSource.getRepository(Rack).save({ code: 'Z9', name: 'Bench rack', workshopId: (await t.dataSource.getRepository(Workshop).find())[0].id })
    await t.dataSource.getRepository(Bin).save(Array.from({ length: LABELS }, (_, i) => ({
      code: `Z9-${String(i + 1).padStart(3, '0')}`, labelCode: newLabelCode('B'), description: `Bench bin ${i + 1}`, rackId: rack.id, retired: false, defaultPartId: null,
    })))
    const body = { selection: { kind: 'bin', rackId: rack.id }, sheetId: 'a4-3x8-70x37' }
    const times: number[] = []
    let bytes = 0
    for (let i = 0; i <= RUNS; i++) {
      const t0 = performance.now()
      const res = await keeper.post('/api/labels/pdf', body).buffer(true).parse((r, done) => {
        const chunks: Buffer[] = []
        r.on('data', (c: Buffer) => chunks.push(c))
        r.on('end', () => done(null, Buffer.concat(chunks)))
      })
      if (res.status !== 200 || res.headers['x-label-count'] !== String(LABELS)) throw new Error(`label PDF answered ${res.status}`)
      if (i > 0) times.push(performance.now() - t0)
      bytes = (res.body as Buffer).length
    }
    return { times, bytes }
  } finally {
    await t.close()
  }
}

/** Time until the first Take button of the bin page can be pressed. */
async function untilUsable(page: Page, go: () => Promise<unknown>) {
  const t0 = performance.now()
  await go()
  await page.locator('[data-testid="action-take"]:not([disabled])').first().waitFor({ state: 'visible' })
  return performance.now() - t0
}

async function binPageTimes() {
  // Chromium first: when it cannot be started (not installed), no server is left running.
  const browser = await launchBrowser()
  const server = await startServer().catch(async (err) => { await browser.close(); throw err })
  try {
    const page = await browser.newPage({ viewport: PHONE })
    await signIn(page, server.url, 'builder')
    const direct: number[] = []
    const typed: number[] = []
    for (let i = 0; i <= RUNS; i++) {
      // A phone camera opening the label's URL: a fresh page load of /bins/<code>.
      const d = await untilUsable(page, () => page.goto(`${server.url}/bins/A1-0${(i % 9) + 1}`))
      await page.goto(`${server.url}/scan`)
      await page.getByTestId('scan-input').waitFor()
      // A handheld scanner typing into the scan page: code + Enter, then the in-app navigation.
      const s = await untilUsable(page, async () => {
        await page.getByTestId('scan-input').fill(`A1-0${(i % 9) + 1}`)
        await page.getByTestId('scan-input').press('Enter')
      })
      if (i > 0) { direct.push(d); typed.push(s) }
    }
    return { direct, typed }
  } finally {
    await browser.close()
    await server.stop()
  }
}

export const labelsSuite = {
  name: `labels and the bin page: a ${LABELS}-label PDF; a scanned code to a usable bin page`,
  async run() {
    const pdf = await labelPdfTimes()
    const p50 = percentile(pdf.times, 50)
    record({ figure: `${LABELS}-label PDF (A4 3 × 8, ${LABELS} distinct QR codes) over HTTP, median of ${RUNS}`, value: p50, unit: 'ms', goal: `≤ ${GOAL_MS} ms`, pass: p50 <= GOAL_MS })
    record({ figure: `${LABELS}-label PDF, slowest of ${RUNS}`, value: Math.max(...pdf.times), unit: 'ms' })
    record({ figure: `${LABELS}-label PDF size`, value: pdf.bytes / 1024, unit: 'KiB' })
    const page = await binPageTimes()
    const direct = percentile(page.direct, 50)
    const typed = percentile(page.typed, 50)
    record({ figure: `bin page from its label URL until Take is usable (Chromium, 390 px), median of ${RUNS}`, value: direct, unit: 'ms', goal: `≤ ${GOAL_MS} ms`, pass: direct <= GOAL_MS })
    record({ figure: 'bin page from its label URL, slowest', value: Math.max(...page.direct), unit: 'ms' })
    record({ figure: `typed code on /scan until Take is usable, median of ${RUNS}`, value: typed, unit: 'ms', goal: `≤ ${GOAL_MS} ms`, pass: typed <= GOAL_MS })
    record({ figure: 'typed code on /scan until Take is usable, slowest', value: Math.max(...page.typed), unit: 'ms' })
  },
}
