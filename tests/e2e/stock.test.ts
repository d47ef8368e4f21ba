import { describe, expect, it } from 'vitest'
import { useBrowserSuite } from '../helpers/browser-suite'
import { PHONE, screenshot } from '../helpers/browser'

const app = useBrowserSuite()

describe('Bins and Ledger screens in Chromium', () => {
  it('lets a storekeeper receive stock into a bin from Bins and then see it on the Ledger', async () => {
    const page = await app.openAs('storekeeper', { path: '/bins' })
    await page.getByTestId('bin-A1-11').click()
    await page.waitForURL(/bin=A1-11/)
    await expect.poll(() => page.getByTestId('bin-title').innerText()).toContain('A1-11')
    await page.getByText('This bin is empty.').waitFor()

    await page.getByTestId('receive').click()
    await page.getByTestId('part-picker').locator('input').fill('7ba nut')
    await page.locator('.ant-select-item-option').filter({ hasText: '7BA-NUT' }).first().click()
    await page.locator('[data-testid="receive-quantity"] input, input[data-testid="receive-quantity"]').fill('25')
    await page.getByPlaceholder('e.g. club order').fill('Club order, winter')
    await page.getByTestId('receive-ok').click()
    const row = page.getByTestId('bin-contents').locator('tbody tr.ant-table-row').filter({ hasText: '7BA-NUT' })
    await row.waitFor()
    expect(await row.innerText()).toMatch(/\b25\b/)
    await screenshot(page, 'bins-keeper-received')

    await page.getByTestId('nav-ledger').click()
    await page.waitForURL(/\/ledger/)
    const first = page.getByTestId('movement-table').locator('tbody tr.ant-table-row').first()
    await expect.poll(() => first.innerText()).toContain('Club order, winter')
    const text = await first.innerText()
    expect(text).toContain('Received')
    expect(text).toContain('7BA-NUT')
    expect(text).toContain('A1-11')
    expect(text).toMatch(/\b25\b/)
    expect(await page.getByTestId('reverse').count()).toBeGreaterThan(0)
    await screenshot(page, 'ledger-keeper')
    await page.close()
  })

  it('shows a viewer the contents and the ledger but no edit controls', async () => {
    const page = await app.openAs('viewer', { path: '/bins?bin=C1-01', viewport: PHONE })
    await page.getByTestId('bin-contents').locator('tbody tr.ant-table-row').filter({ hasText: 'TL-2211' }).waitFor()
    expect(await page.getByTestId('bin-contents').innerText()).toContain('expired')
    for (const id of ['receive', 'new-bin', 'edit-bin', 'retire-bin']) expect(await page.getByTestId(id).count()).toBe(0)
    await screenshot(page, 'bins-viewer-phone')
    await page.goto(`${app.url}/ledger`)
    await page.getByTestId('movement-table').locator('tbody tr.ant-table-row').first().waitFor()
    expect(await page.getByTestId('reverse').count()).toBe(0)
    await screenshot(page, 'ledger-viewer-phone')
    await page.close()
  })
})
