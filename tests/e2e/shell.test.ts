import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { startServer, type RunningServer } from '../helpers/server'
import { DESKTOP, launchBrowser, screenshot, signIn } from '../helpers/browser'
import { NAV_ITEMS } from '../../shared/navigation'
import { ROLES, roleAtLeast } from '../../shared/types/api'

let server: RunningServer
let browser: Browser
beforeAll(async () => {
  server = await startServer()
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
  await server?.stop()
})

describe('the app shell in Chromium', () => {
  it('sends a signed-out visitor to the sign-in page and back to where they were going', async () => {
    const page = await browser.newPage({ viewport: DESKTOP })
    await page.goto(`${server.url}/ledger`)
    await page.waitForURL((u) => u.pathname === '/login' && u.searchParams.get('next') === '/ledger')
    await page.getByTestId('username').fill('viewer')
    await page.locator('input[type="password"]').fill('brass-viewer-1')
    await page.getByTestId('sign-in').click()
    await page.waitForURL((u) => u.pathname === '/ledger')
    await page.close()
  })

  for (const role of ROLES) {
    it(`shows a ${role} the navigation of that role, then signs out`, async () => {
      const page = await browser.newPage({ viewport: DESKTOP })
      await signIn(page, server.url, role)
      await page.getByTestId('nav-today').waitFor()
      const expected = NAV_ITEMS.filter((i) => roleAtLeast(role, i.minRole)).map((i) => i.label)
      const shown = await page.locator('.desktop-nav [data-testid^="nav-"]').allInnerTexts()
      expect(shown.map((s) => s.trim())).toEqual(expected)
      await screenshot(page, `shell-${role}`)
      await page.getByTestId('user-menu').click()
      await page.getByTestId('sign-out').click()
      await page.waitForURL(/\/login/)
      await page.goto(`${server.url}/parts`)
      await page.waitForURL(/\/login/)
      await page.close()
    })
  }
})
