import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useBrowserSuite } from '../helpers/browser-suite'
import { PHONE, screenshot } from '../helpers/browser'
import { jpegBytes, pdfBytes, pngBytes, withExifOrientation } from '../helpers/images'

const app = useBrowserSuite()

/** An id looked up through the API with the page's own session. */
async function apiFirst(page: Page, path: string, pick: (item: { id: number; ownerName?: string; name: string }) => boolean) {
  const body = await (await page.request.get(`${app.url}/api${path}`)).json()
  return (body.items as { id: number; name: string }[]).find(pick)!.id
}

describe('drawings and sketches in Chromium', () => {
  it('lets a storekeeper add a photo, a PDF and see a refusal; view full size; delete after asking', async () => {
    const page = await app.openAs('storekeeper')
    const partId = await apiFirst(page, '/parts?q=whistle', () => true)
    await page.goto(`${app.url}/parts/${partId}`)
    await page.getByTestId('attachment-drop').waitFor()
    // The size limit arrives with the upload rules, a moment after the drop zone.
    await expect.poll(() => page.getByTestId('attachment-drop').innerText()).toMatch(/PDF drawings, up to 20 MB each/)

    const photo = withExifOrientation(await jpegBytes(1200, 900, true), 6)
    await page.getByTestId('attachment-input').setInputFiles([
      { name: 'whistle valve.jpg', mimeType: 'image/jpeg', buffer: photo },
      { name: 'valve body.pdf', mimeType: 'application/pdf', buffer: await pdfBytes('Whistle valve body') },
      { name: 'notes.png', mimeType: 'image/png', buffer: Buffer.from('turn 0.5 mm off the seat') },
    ])
    await page.getByText('notes.png was not added').waitFor()
    await page.getByTitle('Download valve body.pdf').waitFor()
    const thumb = page.locator('img[alt="whistle valve.jpg"]')
    await thumb.waitFor({ timeout: 30_000 })
    expect(await thumb.getAttribute('src')).toMatch(/\/thumb\/160$/)
    // Turned upright by its EXIF tag: a 1200×900 sideways photo gives a portrait 160×213 thumbnail.
    await expect.poll(() => thumb.evaluate((i: HTMLImageElement) => [i.naturalWidth, i.naturalHeight])).toEqual([160, 213])
    await screenshot(page, 'attachments-part-storekeeper')

    await thumb.click()
    const full = page.locator('.ant-modal img.full')
    await full.waitFor()
    await expect.poll(() => full.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBe(800)
    expect(await page.locator('.ant-modal a', { hasText: 'Open the original' }).getAttribute('href')).toMatch(/\/file$/)
    await screenshot(page, 'attachments-full-view')
    await page.keyboard.press('Escape')

    await page.getByRole('button', { name: 'Delete whistle valve.jpg' }).click()
    await page.getByRole('button', { name: 'Delete', exact: true }).click()
    await thumb.waitFor({ state: 'detached' })
    await page.close()
  }, 90_000)

  it("lets a builder on a phone add to their own build, and shows no upload on someone else's", async () => {
    const page = await app.openAs('builder', { viewport: PHONE })
    const own = await apiFirst(page, '/builds', (b) => b.name.startsWith('Single-cylinder vertical engine'))
    const others = await apiFirst(page, '/builds', (b) => b.name.startsWith('Single oscillating engine'))
    await page.goto(`${app.url}/builds/${own}`)
    await page.getByTestId('attachment-input').setInputFiles({ name: 'crankshaft.png', mimeType: 'image/png', buffer: await pngBytes(900, 600) })
    // Below the fold on a phone, and lazy-loaded: wait for it to exist, then bring it into view.
    const thumb = page.locator('img[alt="crankshaft.png"]')
    await thumb.waitFor({ state: 'attached', timeout: 30_000 })
    await thumb.scrollIntoViewIfNeeded()
    await thumb.waitFor()
    await screenshot(page, 'attachments-build-builder-phone')
    await page.goto(`${app.url}/builds/${others}`)
    await page.getByText(/No drawings or sketches yet|Drawings/).first().waitFor()
    expect(await page.getByTestId('attachment-input').count()).toBe(0)
    await page.close()
  }, 60_000)

  it('shows a viewer on a phone the thumbnails but no upload or delete', async () => {
    const page = await app.openAs('viewer', { viewport: PHONE })
    const own = await apiFirst(page, '/builds', (b) => b.name.startsWith('Single-cylinder vertical engine'))
    await page.goto(`${app.url}/builds/${own}`)
    await page.locator('img[alt="crankshaft.png"]').waitFor({ timeout: 30_000 })
    expect(await page.getByTestId('attachment-input').count()).toBe(0)
    expect(await page.getByRole('button', { name: /^Delete / }).count()).toBe(0)
    await screenshot(page, 'attachments-build-viewer-phone')
    await page.close()
  }, 60_000)
})
