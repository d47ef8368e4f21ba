import { describe, expect, it } from 'vitest'
import { useBrowserSuite } from '../helpers/browser-suite'
import { PHONE, screenshot } from '../helpers/browser'
import { picture } from '../helpers/images'

/** The machine is shared with other test runs: allow for a slow page. */
const POLL = { timeout: 30_000 }

const app = useBrowserSuite()

describe('the parts screens in Chromium', () => {
  it('lets a storekeeper create a part, find it, receive it into a bin and add a sketch', async () => {
    const page = await app.openAs('storekeeper', { path: '/parts' })
    await page.getByTestId('new-part').click()
    const form = page.getByTestId('part-form')
    /** ant-design puts a data-testid on the <input> itself or on its wrapper, depending on the control. */
    const input = (id: string) => form.locator(`input[data-testid="${id}"], [data-testid="${id}"] input`).first()
    await form.getByTestId('field-name').fill('3BA stud 25 mm, phosphor bronze')
    await form.getByTestId('field-thread').fill('3 ba')
    await form.getByText('Read as 3BA').waitFor()
    await input('field-lengthMm').fill('25')
    await input('field-material').fill('PB')
    await expect.poll(() => input('field-code').inputValue(), POLL).toBe('3BA-STUD-25-PB')
    await screenshot(page, 'parts-new-part')
    await form.getByTestId('part-save').click()
    await page.waitForURL(/\/parts\/\d+$/)
    const partUrl = page.url()
    await expect.poll(() => page.getByTestId('part-title').innerText(), POLL).toContain('3BA-STUD-25-PB')

    await page.goto(`${app.url}/parts`)
    await page.getByTestId('part-search').fill('3ba stud pb')
    await expect.poll(() => page.getByTestId('query-chips').innerText(), POLL).toContain('thread 3BA')
    await expect.poll(() => page.locator('[data-testid^="part-row-"]').count(), POLL).toBe(1)
    await page.getByTestId('part-row-3BA-STUD-25-PB').waitFor()
    await page.getByTestId('part-search').press('Enter')
    await page.waitForURL(partUrl)

    // Receiving into a bin uses the Bins screen (engineer S), which finds the part with PartPicker.
    await page.goto(`${app.url}/bins?bin=A1-11`)
    await page.getByTestId('receive').click()
    await page.locator('.ant-modal input[data-testid="part-picker"], .ant-modal [data-testid="part-picker"] input').first().fill('3BA-STUD-25-PB')
    await page.locator('.ant-select-item-option', { hasText: '3BA-STUD-25-PB' }).click()
    await page.locator('input[data-testid="receive-quantity"], [data-testid="receive-quantity"] input').first().fill('40')
    await page.getByTestId('receive-ok').click()
    await page.locator('.ant-modal').waitFor({ state: 'hidden' })

    await page.goto(partUrl)
    await expect.poll(() => page.getByTestId('part-totals').innerText(), POLL).toMatch(/On hand\s+40 pcs/)
    await expect.poll(() => page.getByTestId('part-lots').innerText(), POLL).toContain('A1-11')

    // The sketch goes in through the drawings gallery (engineer U).
    const png = await picture(640, 480).getBuffer('image/png')
    await page.getByTestId('attachment-input').setInputFiles({ name: 'stud-sketch.png', mimeType: 'image/png', buffer: png })
    await page.locator('img[alt="stud-sketch.png"]').waitFor({ timeout: 60_000 })
    await screenshot(page, 'parts-detail-storekeeper')
    await page.close()
  }, 240_000)

  it('moves through results with the arrow keys and shows what the query was read as', async () => {
    const page = await app.openAs('builder', { path: '/parts' })
    const search = page.getByTestId('part-search')
    await search.fill('7ba')
    await page.getByTestId('part-row-7BA-WASHER-BR').waitFor()
    expect(await page.getByTestId('query-chips').innerText()).toContain('thread 7BA')
    await search.press('ArrowDown')
    await search.press('ArrowDown')
    expect(await page.locator('tr.row-active').getAttribute('data-testid')).toBe('part-row-7BA-STUD-16-SS303')
    expect(await page.locator('tr.row-active mark').first().innerText()).toBe('7BA')
    await search.fill('thread locker')
    await page.getByTestId('part-row-COM-THREADLOCKER').waitFor()
    await screenshot(page, 'parts-list-builder')
    await search.press('Enter')
    await page.waitForURL(/\/parts\/\d+$/)
    await page.getByTestId('caution-hazard').waitFor()
    expect(await page.getByTestId('lot-expired').count()).toBe(1)
    await page.close()
  }, 120_000)

  it('shows a viewer no edit controls, on the list or on a part, on a phone', async () => {
    const page = await app.openAs('viewer', { path: '/parts?q=whistle', viewport: PHONE })
    await page.getByTestId('part-row-OTH-WHISTLEVALVE').click()
    await page.getByTestId('caution-pressure').waitFor()
    await page.getByTestId('part-attributes').waitFor()
    expect(await page.getByTestId('part-edit-controls').count()).toBe(0)
    expect(await page.getByTestId('attachment-input').count()).toBe(0)
    await screenshot(page, 'parts-detail-viewer-phone')
    await page.goto(`${app.url}/parts`)
    await page.getByTestId('part-search').waitFor()
    expect(await page.getByTestId('new-part').count()).toBe(0)
    expect(await page.getByTestId('csv-open').count()).toBe(0)
    await screenshot(page, 'parts-list-viewer-phone')
    await page.close()
  }, 120_000)
})
