import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useBrowserSuite } from '../helpers/browser-suite'
import { PHONE, screenshot } from '../helpers/browser'
import { decodeQrIn, openPdf } from '../helpers/pdf-labels'
import { findSheet, positionOf } from '../../shared/domain/label-sheets'

const app = useBrowserSuite()

const onHand = (page: Page, partCode: string) =>
  page.getByTestId(`line-${partCode}`).getByTestId('on-hand').innerText()

describe('scanning a label on a phone (390 × 844)', () => {
  it('opens a bin from a typed code, takes one, and shows on hand falling and the movement', async () => {
    const page = await app.openAs('builder', { path: '/scan', viewport: PHONE, hasTouch: true, isMobile: true })
    await page.getByTestId('scan-input').fill('a1-03')
    await page.getByTestId('scan-input').press('Enter')
    await page.waitForURL((u) => u.pathname === '/bins/A1-03')
    await expect.poll(() => page.getByTestId('bin-code').innerText()).toBe('A1-03')
    const nut = page.locator('[data-testid^="line-7BA-NUT"]').first()
    const partCode = (await nut.getAttribute('data-testid'))!.replace('line-', '')
    expect(await onHand(page, partCode)).toBe('120 pcs')
    await page.getByTestId('bin-movement').first().waitFor()
    const before = await page.getByTestId('bin-movement').count()

    await nut.getByTestId('action-take').click()
    const form = page.getByTestId('action-form')
    await expect.poll(() => form.getByTestId('quantity').inputValue()).toBe('1')
    await form.getByTestId('action-confirm').click()
    await expect.poll(() => onHand(page, partCode)).toBe('119 pcs')
    const newest = page.getByTestId('bin-movement').first()
    await expect.poll(() => newest.innerText()).toMatch(/Taken\s+−1\s+7BA full nut, brass/)
    expect(await newest.innerText()).toContain('Nell Ashworth')
    expect(await page.getByTestId('bin-movement').count()).toBeGreaterThanOrEqual(Math.min(before + 1, 5))
    await screenshot(page, 'bin-page-phone')
    await page.close()
  })

  it('says "not one of our labels" for an unknown code and stays on the scan page', async () => {
    const page = await app.openAs('viewer', { path: '/scan', viewport: PHONE, hasTouch: true, isMobile: true })
    await page.getByTestId('scan-input').fill('5012345678900')
    await page.getByTestId('scan-open').click()
    const msg = page.getByTestId('scan-message')
    await msg.waitFor()
    expect(await msg.innerText()).toContain('“5012345678900” is not one of our labels.')
    expect(new URL(page.url()).pathname).toBe('/scan')
    // No camera in headless Chromium: the scan page says so plainly instead of failing silently.
    await page.getByTestId('camera-start').click()
    await expect.poll(() => page.getByTestId('camera-problem').innerText()).toMatch(/camera/i)
    await screenshot(page, 'scan-page-phone')
    await page.close()
  })

  it('opens a whole label URL typed by a handheld scanner, shows the boiler caution, and lists the bin as recent', async () => {
    const page = await app.openAs('viewer', { viewport: PHONE })
    const tube = await (await page.request.get(`${app.url}/api/bins/B1-06`)).json()
    await page.goto(`${app.url}/scan`)
    await page.getByTestId('scan-input').fill(`http://localhost:3000/bins/${tube.bin.labelCode}`)
    await page.getByTestId('scan-input').press('Enter')
    await page.waitForURL((u) => u.pathname === '/bins/B1-06')
    await page.getByTestId('caution-pressure').waitFor()
    expect(await page.getByTestId('action-take').count()).toBe(0)
    await page.goto(`${app.url}/scan`)
    expect(await page.getByTestId('recent-bin').first().innerText()).toContain('B1-06')
    await page.close()
  })
})

describe('the labels screen', () => {
  it('previews a rack of labels at true size from a chosen start position, and prints them at exact millimetres', async () => {
    const page = await app.openAs('storekeeper', { path: '/labels' })
    await page.getByTestId('rack-pick').click()
    await page.getByText('Drawer cabinet A1', { exact: false }).first().click()
    await page.getByTestId('start-5').click()
    const labels = page.getByTestId('label-face')
    await expect.poll(() => labels.count()).toBe(12)
    expect(await page.getByTestId('label-summary').innerText()).toContain('12 labels on 1 sheet · A4 · 3 × 8 · 70 × 37 mm')
    const box = await page.getByTestId('sheet-page').first().boundingBox()
    // A4 at CSS true size: 210 mm = 210 / 25.4 × 96 px.
    expect(box!.width).toBeCloseTo((210 / 25.4) * 96, 0)
    await screenshot(page, 'labels-preview')

    // Print from the browser: one A4 page, the first label at position 5, its QR the bin's URL.
    const printed = openPdf(await page.pdf({ preferCSSPageSize: true }))
    expect(printed.countPages()).toBe(1)
    const at = positionOf(findSheet('a4-3x8-70x37')!, 5)
    const url = decodeQrIn(printed, 0, { xMm: at.xMm, yMm: at.yMm, wMm: 70, hMm: 37 })
    const a101 = await (await page.request.get(`${app.url}/api/bins/A1-01`)).json()
    expect(url).toBe(`${app.url.replace('127.0.0.1', 'localhost')}/bins/${a101.bin.labelCode}`)
    await page.close()
  })
})

describe('a stock-take on a phone', () => {
  it('counts a rack bin by bin, shows the difference before applying, then writes it', async () => {
    const page = await app.openAs('storekeeper', { path: '/stocktake', viewport: PHONE })
    await page.getByTestId('take-scope').click()
    await page.getByText('A3 · Drawer cabinet A3', { exact: false }).click()
    await page.getByTestId('take-start').click()
    await page.getByTestId('take-scan').fill('A3-02')
    await page.getByTestId('take-scan').press('Enter')
    await page.getByTestId('take-bin').waitFor()
    await page.getByTestId('take-count').first().fill('2')
    await page.getByTestId('take-bin-done').click()
    const diff = page.getByTestId('take-diff')
    await expect.poll(() => diff.count()).toBe(1)
    expect(await diff.innerText()).toMatch(/A3-02\s+Valve chest gasket[\s\S]*3[\s\S]*2[\s\S]*−1/)
    await screenshot(page, 'stocktake-review-phone')
    await page.getByTestId('take-apply').click()
    await page.getByTestId('take-start').waitFor()
    const bin = await (await page.request.get(`${app.url}/api/bins/A3-02`)).json()
    expect(bin.lines[0].quantity).toBe(2)
    await page.close()
  })
})
