import { existsSync, mkdirSync } from 'node:fs'
import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core'
import { DEMO_USERS } from '../../seeds/demo-users'
import type { Role } from '../../shared/types/api'

export const PHONE = { width: 390, height: 844 }
export const DESKTOP = { width: 1440, height: 900 }

export function chromiumPath(): string {
  const path = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome']
    .find((p) => p && existsSync(p))
  if (!path) throw new Error('No Chromium found: run `node scripts/find-chromium.mjs` or set CHROMIUM_PATH')
  return path
}

/** Debian's Chromium, headless; the flags keep it off the (closed) network and work as root. */
export function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  return chromium.launch({
    executablePath: chromiumPath(),
    headless: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage', ...extraArgs,
    ],
  })
}

/** Signs in through the login form as the demo user of `role`. */
export async function signIn(page: Page, baseUrl: string, role: Role) {
  const user = DEMO_USERS.find((u) => u.role === role)!
  await page.goto(`${baseUrl}/login`)
  await page.getByTestId('username').fill(user.username)
  await page.locator('input[type="password"]').fill(user.password)
  await page.getByTestId('sign-in').click()
  await page.waitForURL((u) => !u.pathname.startsWith('/login'))
}

/**
 * A page in a context of its own, phone-sized with touch or desk-sized, signed in as `role`;
 * close it with `page.context().close()`.
 */
export async function signedInPage(browser: Browser, baseUrl: string, role: Role, phone: boolean, options: BrowserContextOptions = {}) {
  const context = await browser.newContext({ viewport: phone ? PHONE : DESKTOP, isMobile: phone, hasTouch: phone, ...options })
  const page = await context.newPage()
  await signIn(page, baseUrl, role)
  return page
}

/** Opens `path` and waits for `ready`, something that shows once the screen has its data. */
export async function openScreen(page: Page, baseUrl: string, path: string, ready: string) {
  await page.goto(`${baseUrl}${path}`)
  await page.locator(ready).first().waitFor()
}

export async function screenshot(page: Page, name: string) {
  mkdirSync('test-results', { recursive: true })
  await page.screenshot({ path: `test-results/${name}.png`, fullPage: true })
}
