/** The ways in that a new user's read-through found missing: racks and workshops, stock-take, the outbox. */
import { describe, expect, it } from 'vitest'
import { useBrowserSuite } from '../helpers/browser-suite'

const app = useBrowserSuite()

describe('ways in from Bins and Admin', () => {
  it('lets a storekeeper add a workshop and a rack in it from Bins, and reach the stock-take', async () => {
    const page = await app.openAs('storekeeper', { path: '/bins' })
    await page.getByTestId('new-workshop').click()
    await page.getByTestId('place-name').fill('Boiler shop')
    await page.getByRole('button', { name: 'Add' }).click()
    await page.locator('.ant-tree').getByText('Boiler shop').waitFor()

    await page.getByTestId('new-rack').click()
    await page.getByTestId('rack-code').fill('d1')
    await page.locator('.ant-modal .ant-select').click()
    await page.locator('.ant-select-item-option', { hasText: 'Boiler shop' }).click()
    await page.getByTestId('place-name').fill('Shelf D1 — copper tube')
    await page.getByRole('button', { name: 'Add' }).click()
    await page.locator('.ant-tree').getByText(/D1 · Shelf D1 — copper tube/).waitFor()
    const tree = await (await page.request.get(`${app.url}/api/bins`)).json()
    const shop = tree.workshops.find((w: { name: string }) => w.name === 'Boiler shop')
    expect(shop.racks.map((r: { code: string }) => r.code)).toEqual(['D1'])

    await page.getByTestId('go-stocktake').click()
    await page.waitForURL((u) => u.pathname === '/stocktake')
    await page.getByTestId('take-start').waitFor()
    await page.close()
  })

  it('takes an admin from Admin to the outbox', async () => {
    const page = await app.openAs('admin', { path: '/admin' })
    await page.getByTestId('go-outbox').click()
    await page.waitForURL((u) => u.pathname === '/admin/outbox')
    await page.close()
  })
})
