/**
 * Regenerates docs/screenshots/*.png from the demo workshop: starts the server as `npm start` does
 * on a fresh demo database, signs in with the role each screen is for, and photographs the
 * viewport (phone size for the pages used at the drawer). Run with `npm run screenshots`
 * (set CLIENT_DIR to use a client built elsewhere).
 */
import { mkdirSync } from 'node:fs'
import type { Browser, Page } from 'playwright-core'
import { startServer } from '../tests/helpers/server'
import { PHONE, launchBrowser, openScreen, signedInPage } from '../tests/helpers/browser'
import type { Role } from '../shared/types/api'

const OUT_DIR = 'docs/screenshots'

interface Shot {
  file: string
  path: string
  role: Role
  /** Something that shows once the screen has its data. */
  ready: string
  phone?: boolean
  /** Optional step before the picture, e.g. opening a drawer. */
  prepare?: (page: Page) => Promise<void>
}

const SHOTS: Shot[] = [
  { file: 'today', path: '/', role: 'storekeeper', ready: '[data-testid="today-low"]' },
  { file: 'parts', path: '/parts?q=7ba', role: 'builder', ready: '.ant-table-row' },
  { file: 'part', path: '/parts/3', role: 'storekeeper', ready: '[data-testid="part-totals"]' },
  { file: 'bins', path: '/bins', role: 'storekeeper', ready: '.page h1' },
  { file: 'bin-phone', path: '/bins/A1-03', role: 'builder', ready: '[data-testid="bin-movement"]', phone: true },
  { file: 'scan-phone', path: '/scan', role: 'builder', ready: '[data-testid="scan-input"]', phone: true },
  { file: 'labels', path: '/labels', role: 'storekeeper', ready: '.page h1', prepare: async (page) => {
    await page.getByTestId('rack-pick').click()
    await page.locator('.ant-select-item-option').first().click()
    await page.getByTestId('label-face').first().waitFor()
  } },
  { file: 'builds', path: '/builds', role: 'builder', ready: '.build-progress' },
  { file: 'build', path: '/builds/1', role: 'builder', ready: '[data-testid="bom-table"] .ant-table-row' },
  { file: 'orders', path: '/orders?suggest=1', role: 'storekeeper', ready: '[data-testid^="suggestions-"]' },
  { file: 'suppliers', path: '/suppliers', role: 'storekeeper', ready: '.ant-table-row' },
  { file: 'workbench', path: '/workbench', role: 'builder', ready: '.page h1' },
  { file: 'ledger', path: '/ledger', role: 'storekeeper', ready: '.ant-table-row' },
  { file: 'stocktake-phone', path: '/stocktake', role: 'storekeeper', ready: '[data-testid="take-start"]', phone: true },
  { file: 'admin', path: '/admin', role: 'admin', ready: '.ant-table-row' },
]

async function shoot(browser: Browser, url: string, role: Role, shots: Shot[]) {
  for (const phone of [false, true]) {
    const mine = shots.filter((s) => !!s.phone === phone)
    if (!mine.length) continue
    const page = await signedInPage(browser, url, role, phone, { deviceScaleFactor: 1 })
    for (const s of mine) {
      await openScreen(page, url, s.path, s.ready)
      await s.prepare?.(page)
      // Let web fonts and chart animations settle without a fixed sleep.
      await page.evaluate(() => document.fonts.ready)
      await page.waitForLoadState('networkidle')
      await page.screenshot({ path: `${OUT_DIR}/${s.file}.png`, animations: 'disabled' })
      console.log(`wrote ${OUT_DIR}/${s.file}.png (${role})`)
    }
    await page.context().close()
  }
}

async function main() {
  mkdirSync(OUT_DIR, { recursive: true })
  // Chromium first: when it cannot be started (not installed), no server is left running.
  const browser = await launchBrowser()
  const server = await startServer().catch(async (err) => { await browser.close(); throw err })
  try {
    await shootAll(browser, server.url)
  } finally {
    await browser.close()
    await server.stop()
  }
}

async function shootAll(browser: Browser, url: string) {
  const login = await browser.newPage({ viewport: PHONE, isMobile: true, hasTouch: true })
  await login.goto(`${url}/login`)
  await login.getByTestId('username').waitFor()
  await login.screenshot({ path: `${OUT_DIR}/login-phone.png` })
  await login.close()
  for (const role of ['builder', 'storekeeper', 'admin'] as Role[]) {
    await shoot(browser, url, role, SHOTS.filter((s) => s.role === role))
  }
}

main().catch((err) => {
  console.error(err)
  process.exitCode = 1
})
