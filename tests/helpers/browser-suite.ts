import { afterAll, beforeAll } from 'vitest'
import type { Browser, BrowserContextOptions, Page } from 'playwright-core'
import { startServer, type RunningServer } from './server'
import { DESKTOP, launchBrowser, signIn } from './browser'
import type { Role } from '../../shared/types/api'

export type PageOptions = BrowserContextOptions & { path?: string }

export interface BrowserSuite {
  /** The running server's address, e.g. http://127.0.0.1:41234. */
  readonly url: string
  readonly server: RunningServer
  readonly browser: Browser
  /** A new page (desk size unless `options` say otherwise) signed in as `role`, at `path` if given. */
  openAs: (role: Role, options?: PageOptions) => Promise<Page>
}

/**
 * Registers the set-up every browser test file shares: the real server on a fresh demo database
 * and one Chromium, both started before the file's tests and closed after them. `env` is read
 * when the server starts, so it may name things another beforeAll made (a mail sink's port).
 */
export function useBrowserSuite(env: () => Record<string, string> = () => ({})): BrowserSuite {
  let server: RunningServer
  let browser: Browser
  beforeAll(async () => {
    server = await startServer(env())
    browser = await launchBrowser()
  })
  afterAll(async () => {
    await browser?.close()
    await server?.stop()
  })
  return {
    get url() { return server.url },
    get server() { return server },
    get browser() { return browser },
    async openAs(role, { path, ...options }: PageOptions = {}) {
      const page = await browser.newPage({ viewport: DESKTOP, ...options })
      await signIn(page, server.url, role)
      if (path !== undefined) await page.goto(`${server.url}${path}`)
      return page
    },
  }
}
