/**
 * The three workshop journeys of issue 11, each on a phone (390 × 844) and a desk (1440 × 900),
 * against the server started as `npm start` starts it on a fresh demo database. The journeys of one
 * viewport share a server and run in order; each viewport gets its own fresh server, so the
 * figures asserted are the same on both.
 */
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Locator, Page } from 'playwright-core'
import { useBrowserSuite } from '../helpers/browser-suite'
import { DESKTOP, PHONE, launchBrowser, screenshot, signIn } from '../helpers/browser'
import { parseMail } from '../helpers/mail'
import { openPdf, pageText } from '../helpers/pdf-labels'
import { writeQrY4m } from '../helpers/qr-video'
import { demoUser } from '../helpers/app'
import type { Role } from '../../shared/types/api'
import { startMailSink, type MailSink } from '../../server/services/mail-sink'

/** The vertical engine of the demo (the builder's active build) needs 24 of these and holds none. */
const NUT = /^7BA-NUT/
/** Valve chest gasket: 3 in stock against a reorder point of 4, so low from the start. */
const LOW_PART = 'GSK-0.25-PAP'

let sink: MailSink
beforeAll(async () => { sink = await startMailSink() })
afterAll(async () => { await sink?.close() })

/** An input by test id, whether the id sits on the input or on its wrapper (a-input-number). */
const field = (page: Page, id: string) => page.locator(`input[data-testid="${id}"], [data-testid="${id}"] input`).first()
const bomRows = (page: Page) => page.locator('[data-testid="bom-table"] tbody tr.ant-table-row')
const lineRow = (page: Page, code: RegExp) => bomRows(page).filter({ hasText: code })
/** A BOM line's held / drawn figure: its own column on a desk, the one-line summary on a phone. */
async function figure(row: Locator, which: 'held' | 'drawn') {
  const compact = row.locator('.compact')
  if (await compact.isVisible()) return new RegExp(`${which} (\\S+ \\S+)`).exec(await compact.innerText())![1]
  return row.locator('td').nth(which === 'held' ? 2 : 3).innerText()
}
const binLine = (page: Page) => page.locator('[data-testid^="line-7BA-NUT"]').first()

async function openLaunchBuild(page: Page, url: string) {
  await page.goto(`${url}/builds`)
  await page.getByRole('link', { name: /Single-cylinder vertical engine/ }).first().click()
  await page.waitForURL(/\/builds\/\d+$/)
  await lineRow(page, NUT).waitFor()
}

/** Journey 1: the nuts held for the builder's build, drawn at the bin the label opened. */
async function drawTwoNutsAtBin(page: Page, shot: string) {
  const line = binLine(page)
  await expect.poll(() => line.getByTestId('on-hand').innerText()).toBe('120 pcs')
  expect(await line.getByTestId('reserved').innerText()).toMatch(/^24 pcs/)
  await page.getByTestId('bin-movement').first().waitFor()
  await line.getByTestId('action-draw').click()
  const form = page.getByTestId('action-form')
  await expect.poll(() => form.getByTestId('draw-line').first().innerText()).toMatch(/Single-cylinder vertical engine[\s\S]*cylinder cover nuts[\s\S]*24 pcs reserved/)
  await form.getByTestId('quantity').fill('2')
  await form.getByTestId('action-confirm').click()
  await expect.poll(() => line.getByTestId('on-hand').innerText()).toBe('118 pcs')
  expect(await line.getByTestId('reserved').innerText()).toMatch(/^22 pcs/)
  const newest = page.getByTestId('bin-movement').first()
  await expect.poll(() => newest.innerText()).toMatch(/−2\s+7BA full nut, brass/)
  expect(await newest.innerText()).toContain('Nell Ashworth')
  expect(await newest.innerText()).toContain('Single-cylinder vertical engine')
  await screenshot(page, shot)
}

/** Journey 2's picker: a typed trade query, the part chosen from the list, then a quantity. */
async function addBySearch(page: Page, query: string, code: RegExp, quantity: number, pieces?: number) {
  await field(page, 'part-picker').fill(query)
  const option = page.locator('.ant-select-item-option').filter({ hasText: code }).first()
  await option.waitFor()
  await option.click()
  await field(page, 'line-quantity').fill(String(quantity))
  if (pieces) await page.getByLabel('Pieces').fill(String(pieces))
  const before = await bomRows(page).count()
  await page.getByTestId('add-line').click()
  await expect.poll(() => bomRows(page).count()).toBe(before + 1)
}

function journeys(viewport: typeof PHONE, label: string, phone: boolean) {
  describe(`the three journeys on a ${label}`, () => {
    const app = useBrowserSuite(() => ({ SMTP_HOST: sink.host, SMTP_PORT: String(sink.port) }))
    const openAs = (role: Role, path?: string) => app.openAs(role, { path, viewport, hasTouch: phone, isMobile: phone })

    it('1. scan a bin label: a builder types the code as a scanner would and draws two nuts held for the build', async () => {
      const page = await openAs('builder')
      // The demo's vertical engine holds no nuts yet: reserve its nut line first, from the build.
      await openLaunchBuild(page, app.url)
      await lineRow(page, NUT).getByRole('button', { name: 'Reserve' }).click()
      await expect.poll(() => figure(lineRow(page, NUT), 'held')).toBe('24 pcs')

      await page.goto(`${app.url}/scan`)
      await page.getByTestId('scan-input').pressSequentially('A1-03')
      await page.getByTestId('scan-input').press('Enter')
      await page.waitForURL((u) => u.pathname === '/bins/A1-03')
      await drawTwoNutsAtBin(page, `journey-scan-${label}`)

      // The build shows the draw: 2 drawn, 22 still held.
      await openLaunchBuild(page, app.url)
      const row = lineRow(page, NUT)
      await expect.poll(() => figure(row, 'drawn')).toBe('2 pcs')
      expect(await figure(row, 'held')).toBe('22 pcs')
      await page.close()
    })

    if (!phone) {
      it('1b. scan a bin label with the camera: a fake camera showing the QR label opens the bin page', async () => {
        const probe = await openAs('builder')
        const bin = await (await probe.request.get(`${app.url}/api/bins/A1-03`)).json()
        await probe.close()
        const dir = mkdtempSync(join(tmpdir(), 'binwright-qr-'))
        const video = join(dir, 'label.y4m')
        writeQrY4m(video, `http://localhost:3000/bins/${bin.bin.labelCode}`)
        const cameraBrowser = await launchBrowser([
          '--use-fake-ui-for-media-stream', '--use-fake-device-for-media-stream', `--use-file-for-fake-video-capture=${video}`,
        ])
        try {
          const page = await cameraBrowser.newPage({ viewport })
          await signIn(page, app.url, 'builder')
          await page.goto(`${app.url}/scan`)
          await page.getByTestId('camera-start').click()
          await page.waitForURL((u) => u.pathname === '/bins/A1-03', { timeout: 20_000 })
          expect(await page.getByTestId('bin-code').innerText()).toBe('A1-03')
          await binLine(page).waitFor()
        } finally {
          await cameraBrowser.close()
          rmSync(dir, { recursive: true, force: true })
        }
      })
    }

    it('2. reserve fasteners for a build: a new mill-engine build, four lines by trade queries, a shortage, a cutting plan printed', async () => {
      const page = await openAs('builder', '/builds')
      await page.getByTestId('new-build').click()
      const name = `Horizontal mill engine (${label})`
      await page.getByTestId('build-name').fill(name)
      await page.getByRole('button', { name: 'Open the build' }).click()
      await page.waitForURL(/\/builds\/\d+$/)
      await page.getByRole('heading', { name }).waitFor()

      await addBySearch(page, '5ba stud', /^5BA-STUD/, 8)
      await addBySearch(page, '5ba nut', /^5BA-NUT/, 8)
      // Six cover gaskets in stock, four held by the vertical engine: eight needed is six short.
      await addBySearch(page, 'gasket 0.4', /^GSK-0\.4/, 8)
      await addBySearch(page, 'brass round 3/8', /^ROUND-9\.525/, 45, 2)

      await page.getByTestId('reserve-all').click()
      await page.getByRole('button', { name: 'Reserve what there is' }).click()
      const shortRows = page.locator('[data-testid="shortages"] tbody tr.ant-table-row')
      await shortRows.first().waitFor()
      expect(await shortRows.count()).toBe(1)
      expect(await shortRows.first().innerText()).toMatch(/GSK-0\.4[\s\S]*6 pcs/)
      expect(await lineRow(page, /GSK-0\.4/).locator('[data-state]').getAttribute('data-state')).toBe('short')
      expect(await lineRow(page, /5BA-STUD/).locator('[data-state]').innerText()).toMatch(/Covered/)
      expect(await lineRow(page, /5BA-NUT/).locator('[data-state]').innerText()).toMatch(/Covered/)
      expect(await figure(lineRow(page, /5BA-NUT/), 'held')).toBe('8 pcs')

      // The cutting plan for the bar, printed alone: the print button marks the card, print CSS hides the rest.
      const plan = page.locator('[data-testid^="cutting-plan-"]').filter({ hasText: /ROUND-9\.525/ })
      await expect.poll(() => plan.innerText()).toMatch(/2 piece\(s\) to cut/)
      await screenshot(page, `journey-build-${label}`)
      await page.evaluate(() => { window.print = () => undefined })
      await plan.getByRole('button', { name: 'Print for the saw' }).click()
      await page.emulateMedia({ media: 'print' })
      await screenshot(page, `journey-cutting-plan-print-${label}`)
      const pdf = openPdf(await page.pdf({ format: 'A4' }))
      const text = Array.from({ length: pdf.countPages() }, (_, i) => pageText(pdf, i)).join('\n')
      expect(text).toContain(name)
      expect(text).toMatch(/ROUND-9\.525\S* — 2 × 45 mm/)
      expect(text).toMatch(/Saw off a [\d.]+ mm blank/)
      expect(text).toMatch(/offcut [\d.]+ mm stays in B1-02/)
      expect(text).not.toContain('Print for the saw')
      expect(text).not.toContain('GSK-0.4')
      expect(text).not.toContain('Reserve all')
      // The plan starts the page, not below the blank space where the rest of the build stood.
      expect(text.trimStart()).toMatch(/^ROUND-9\.525/)
      await page.close()
    })

    it('3. reorder when the low-stock e-mail arrives: from the digest link to a received order, and Today clears', async () => {
      const page = await openAs('storekeeper', '/orders')
      const before = sink.messages.length
      await page.getByTestId('send-digest').click()
      await sink.waitFor(before + 1, 20_000)
      const digest = parseMail(sink.messages[before].raw)
      expect(sink.messages[before].to).toEqual([demoUser('storekeeper').email])
      expect(digest.text).toContain(`${LOW_PART} Valve chest gasket 0.25 mm, gasket paper: 3 pcs available (on hand 3, reserved 0), reorder point 4`)
      // The link names the server as the e-mail's reader sees it; follow it on this server's address.
      const link = new URL(/(http:\/\/\S+\/orders\?suggest=1)/.exec(digest.text)![1])
      expect(link.port).toBe(new URL(app.url).port)
      await page.goto(`${app.url}${link.pathname}${link.search}`)

      const group = page.locator('[data-testid^="suggestions-"]', { hasText: LOW_PART })
      await group.waitFor()
      await group.getByTestId('create-draft').click()
      await page.waitForURL((u) => u.searchParams.has('order'))
      await expect.poll(() => page.getByTestId('order-status').innerText()).toBe('draft')
      const sent = sink.messages.length
      await page.getByTestId('send-order').click()
      await page.getByRole('button', { name: 'Send the order' }).click()
      await expect.poll(() => page.getByTestId('order-status').innerText(), { timeout: 20_000 }).toBe('sent')
      await sink.waitFor(sent + 1, 20_000)
      const order = parseMail(sink.messages[sent].raw)
      expect(order.text).toContain(`(our code ${LOW_PART}): 10 pack(s)`)
      expect(order.attachments).toHaveLength(1)

      await page.getByTestId('receive-order').click()
      await page.getByRole('button', { name: 'Receive into stock' }).click()
      await expect.poll(() => page.getByTestId('order-status').innerText(), { timeout: 20_000 }).toBe('received')
      await expect.poll(() => page.getByTestId(`received-${LOW_PART}`).innerText()).toBe('10')
      await screenshot(page, `journey-order-${label}`)

      const bin = await (await page.request.get(`${app.url}/api/bins/A3-02`)).json()
      expect(bin.lines.find((l: { partCode: string }) => l.partCode === LOW_PART).quantity).toBe(13)
      await page.goto(`${app.url}/`)
      await page.getByTestId('today-low').waitFor()
      await expect.poll(() => page.getByTestId('today-low').innerText()).not.toContain(LOW_PART)
      expect(await page.locator('.page').innerText()).not.toContain(LOW_PART)
      await page.close()
    })
  })
}

journeys(PHONE, 'phone', true)
journeys(DESKTOP, 'desktop', false)
