import { describe, expect, it } from 'vitest'
import { useBrowserSuite } from '../helpers/browser-suite'
import { DESKTOP, screenshot } from '../helpers/browser'
import { NAV_ITEMS } from '../../shared/navigation'
import { ROLES, roleAtLeast } from '../../shared/types/api'

const app = useBrowserSuite()

describe('the app shell in Chromium', () => {
  it('sends a signed-out visitor to the sign-in page and back to where they were going', async () => {
    const page = await app.browser.newPage({ viewport: DESKTOP })
    await page.goto(`${app.url}/ledger`)
    await page.waitForURL((u) => u.pathname === '/login' && u.searchParams.get('next') === '/ledger')
    await page.getByTestId('username').fill('viewer')
    await page.locator('input[type="password"]').fill('brass-viewer-1')
    await page.getByTestId('sign-in').click()
    await page.waitForURL((u) => u.pathname === '/ledger')
    await page.close()
  })

  for (const role of ROLES) {
    it(`shows a ${role} the navigation of that role, then signs out`, async () => {
      const page = await app.openAs(role)
      await page.getByTestId('nav-today').waitFor()
      const expected = NAV_ITEMS.filter((i) => roleAtLeast(role, i.minRole)).map((i) => i.label)
      const shown = await page.locator('.desktop-nav [data-testid^="nav-"]').allInnerTexts()
      expect(shown.map((s) => s.trim())).toEqual(expected)
      await screenshot(page, `shell-${role}`)
      await page.getByTestId('user-menu').click()
      await page.getByTestId('sign-out').click()
      await page.waitForURL(/\/login/)
      await page.goto(`${app.url}/parts`)
      await page.waitForURL(/\/login/)
      await page.close()
    })
  }
})
