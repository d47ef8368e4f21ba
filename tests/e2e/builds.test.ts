import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useBrowserSuite } from '../helpers/browser-suite'
import { PHONE, screenshot } from '../helpers/browser'

const app = useBrowserSuite()

/** An input by test id, whether the id sits on the input or on its wrapper (a-input-number). */
const field = (page: Page, id: string) => page.locator(`input[data-testid="${id}"], [data-testid="${id}"] input`).first()

/** Finds a part with the picker by what the trade types, and adds it as a line. */
async function addBySearch(page: Page, query: string, code: RegExp, quantity: number) {
  const picker = field(page, 'part-picker')
  await picker.fill(query)
  const option = page.locator('.ant-select-item-option').filter({ hasText: code }).first()
  await option.waitFor()
  await option.click()
  await field(page, 'line-quantity').fill(String(quantity))
  const before = await page.locator('[data-testid="bom-table"] tbody tr.ant-table-row').count()
  await page.getByTestId('add-line').click()
  await page.waitForFunction((n) => document.querySelectorAll('[data-testid="bom-table"] tbody tr.ant-table-row').length === n, before + 1)
}

const lineRow = (page: Page, code: RegExp) => page.locator('[data-testid="bom-table"] tbody tr.ant-table-row').filter({ hasText: code })

describe('a builder\'s build in Chromium', () => {
  it('creates a build, adds three lines by search, reserves all, sees the shortage, draws a line, returns some of it, changes its note, and the part page shows the new on hand', async () => {
    const page = await app.openAs('builder', { path: '/builds' })
    await page.getByTestId('new-build').click()
    await page.getByTestId('build-name').fill('Horizontal mill engine')
    await page.getByRole('button', { name: 'Open the build' }).click()
    await page.waitForURL(/\/builds\/\d+$/)
    await page.getByRole('heading', { name: /Horizontal mill engine/ }).waitFor()

    await addBySearch(page, '6ba nut', /^6BA-NUT/, 8)
    await addBySearch(page, 'm3 x 12', /^M3-SCREW-12/, 6)
    // Three valve chest gaskets are in stock: five is one line short.
    await addBySearch(page, 'gasket paper', /^GSK-0.25/, 5)

    await page.getByTestId('reserve-all').click()
    await page.getByRole('button', { name: 'Reserve what there is' }).click()
    await page.locator('[data-testid="shortages"] tbody tr.ant-table-row').first().waitFor()
    const shortRows = page.locator('[data-testid="shortages"] tbody tr.ant-table-row')
    expect(await shortRows.count()).toBe(1)
    expect(await shortRows.first().innerText()).toMatch(/GSK-0\.25[\s\S]*2 pcs/)
    expect(await lineRow(page, /GSK-0\.25/).locator('[data-state]').getAttribute('data-state')).toBe('short')
    expect(await lineRow(page, /6BA-NUT/).locator('[data-state]').innerText()).toMatch(/Covered/)
    await screenshot(page, 'builds-detail-reserved')

    const nutRow = lineRow(page, /6BA-NUT/)
    await nutRow.getByRole('button', { name: 'Draw' }).click()
    await page.getByRole('button', { name: 'Draw from stores' }).click()
    // Columns: part, needs, reserved, drawn, stores.
    await expect.poll(() => nutRow.locator('td').nth(3).innerText(), { timeout: 10_000 }).toBe('8 pcs')
    expect(await nutRow.locator('td').nth(2).innerText()).toBe('0 pcs')
    await screenshot(page, 'builds-detail-drawn')

    // Three of the eight go back to a bin, through the line's menu.
    const menuItem = async (name: string) => {
      await nutRow.getByRole('button', { name: /^More for/ }).click()
      await page.getByRole('menuitem', { name }).click()
    }
    await menuItem('Return to a bin')
    await page.getByTestId('return-quantity').fill('3')
    await page.getByRole('button', { name: 'Return to the bin' }).click()
    await expect.poll(() => nutRow.locator('td').nth(3).innerText(), { timeout: 10_000 }).toBe('5 pcs')
    // And the line's note changes through the same frame of dialog.
    await menuItem('Change quantity or note')
    const dialog = page.locator('.ant-modal', { hasText: 'Change 6BA-NUT' })
    await dialog.getByTestId('line-note').fill('valve chest nuts')
    await dialog.getByRole('button', { name: 'Save' }).click()
    await expect.poll(() => nutRow.innerText(), { timeout: 10_000 }).toContain('valve chest nuts')

    await nutRow.locator('a').first().click()
    await page.waitForURL(/\/parts\/\d+$/)
    // 35 in A1-06 before; 8 drawn for the build, 3 of them returned.
    await expect.poll(() => page.getByTestId('part-totals').innerText(), { timeout: 10_000 }).toMatch(/On hand\s+30 pcs/)
    await page.getByTestId('part-reservations').waitFor()
    await screenshot(page, 'builds-part-after-draw')
    await page.close()
  })

  it('shows the build list with progress on a phone', async () => {
    const page = await app.openAs('builder', { path: '/builds', viewport: PHONE })
    await page.getByRole('link', { name: 'Horizontal mill engine' }).first().waitFor()
    expect(await page.locator('.build-progress').first().innerText()).toMatch(/lines held/)
    await screenshot(page, 'builds-list-phone')
    await page.close()
  })
})
