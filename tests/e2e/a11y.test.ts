/**
 * Every main screen through axe-core (WCAG 2.1 A and AA rules, contrast included), signed in with
 * a role that sees it; no serious or critical violations allowed. Also: the main actions are
 * reachable with Tab and show a focus ring.
 */
import { createRequire } from 'node:module'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { useBrowserSuite } from '../helpers/browser-suite'
import { PHONE, openScreen, signedInPage } from '../helpers/browser'
import type { Role } from '../../shared/types/api'

const AXE = createRequire(import.meta.url).resolve('axe-core')
/** axe's tags for WCAG 2.0 / 2.1 levels A and AA, the level the issue asks for. */
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']
const BLOCKING = new Set(['serious', 'critical'])
/** Scripts axe injects must run; transitions are off so axe reads settled colours. */
const AXE_CONTEXT = { bypassCSP: true, reducedMotion: 'reduce' } as const

interface Screen { name: string; path: string; role: Role; ready: string; phone?: boolean }
const SCREENS: Screen[] = [
  { name: 'Today', path: '/', role: 'storekeeper', ready: '[data-testid="today-low"]' },
  { name: 'Parts', path: '/parts', role: 'builder', ready: '.ant-table-row' },
  { name: 'a part', path: '/parts/1', role: 'storekeeper', ready: '[data-testid="part-totals"]' },
  { name: 'Bins', path: '/bins', role: 'storekeeper', ready: '.page h1' },
  { name: 'a bin', path: '/bins/A1-03', role: 'builder', ready: '[data-testid="bin-movement"]', phone: true },
  { name: 'Scan', path: '/scan', role: 'builder', ready: '[data-testid="scan-input"]', phone: true },
  { name: 'Labels', path: '/labels', role: 'storekeeper', ready: '.page h1' },
  { name: 'Builds', path: '/builds', role: 'builder', ready: '.ant-table-row, .build-progress' },
  { name: 'a build', path: '/builds/1', role: 'builder', ready: '[data-testid="bom-table"] .ant-table-row' },
  { name: 'Orders', path: '/orders', role: 'storekeeper', ready: '[data-testid="send-digest"]' },
  { name: 'Suppliers', path: '/suppliers', role: 'storekeeper', ready: '.ant-table-row' },
  { name: 'Workbench', path: '/workbench', role: 'viewer', ready: '.page h1' },
  { name: 'Ledger', path: '/ledger', role: 'storekeeper', ready: '.ant-table-row' },
  { name: 'Admin', path: '/admin', role: 'admin', ready: '.ant-table-row' },
  { name: 'Stock-take', path: '/stocktake', role: 'storekeeper', ready: '[data-testid="take-start"]', phone: true },
  { name: 'Outbox', path: '/admin/outbox', role: 'admin', ready: '.page h1' },
]

interface Finding { id: string; impact: string; help: string; nodes: string[] }

/**
 * Faults inside ant-design-vue 4.2.6's own widgets that no prop of ours reaches, left out of the
 * count (and listed in the issue's closing note): the select's search box is a combobox whose
 * aria-controls / aria-owns name a list rendered only once it opens (and lacks aria-expanded until
 * then), the tree's nodes carry aria-grabbed on role-less divs, and the pagination's page-size
 * select has no way to take a label.
 */
const LIBRARY_FAULTS: { rules: string[]; inside: string }[] = [
  { rules: ['aria-required-attr', 'aria-valid-attr-value'], inside: '.ant-select-selector' },
  { rules: ['aria-required-children', 'aria-allowed-attr'], inside: '.ant-tree' },
  { rules: ['label', 'aria-required-attr', 'aria-valid-attr-value'], inside: '.ant-pagination-options' },
]

async function axe(page: Page): Promise<Finding[]> {
  await page.addScriptTag({ path: AXE })
  return page.evaluate(async ({ tags, faults }) => {
    type Node = { target: string[]; html: string }
    const w = window as unknown as { axe: { run: (c: Document, o: object) => Promise<{ violations: { id: string; impact: string; help: string; nodes: Node[] }[] }> } }
    const r = await w.axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] })
    const ours = (id: string, n: Node) => !faults.some((f) => f.rules.includes(id) && document.querySelector(n.target[0])?.closest(f.inside))
    return r.violations
      .map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.filter((n) => ours(v.id, n)).slice(0, 5).map((n) => `${n.target.join(' ')} ${n.html.slice(0, 160)}`) }))
      .filter((v) => v.nodes.length)
  }, { tags: WCAG_AA, faults: LIBRARY_FAULTS })
}

const app = useBrowserSuite()

const blocking = (found: Finding[]) => found.filter((f) => BLOCKING.has(f.impact))
const describeFindings = (found: Finding[]) => found.map((f) => `${f.impact} ${f.id}: ${f.help} — ${f.nodes.join(' | ')}`).join('\n')

describe('axe-core on every main screen', () => {
  it('finds no serious or critical WCAG A/AA violation on the sign-in page', async () => {
    const page = await app.browser.newPage({ viewport: PHONE, ...AXE_CONTEXT })
    await page.goto(`${app.url}/login`)
    await page.getByTestId('username').waitFor()
    expect(describeFindings(blocking(await axe(page)))).toBe('')
    await page.close()
  })

  for (const role of ['builder', 'storekeeper', 'admin', 'viewer'] as Role[]) {
    const screens = SCREENS.filter((s) => s.role === role)
    it(`finds no serious or critical WCAG A/AA violation on ${screens.map((s) => s.name).join(', ')} (${role})`, async () => {
      const deskPage = await signedInPage(app.browser, app.url, role, false, AXE_CONTEXT)
      const phonePage = await signedInPage(app.browser, app.url, role, true, AXE_CONTEXT)
      const report: string[] = []
      for (const s of screens) {
        const page = s.phone ? phonePage : deskPage
        await openScreen(page, app.url, s.path, s.ready)
        const found = blocking(await axe(page))
        if (found.length) report.push(`${s.name} (${s.path}):\n${describeFindings(found)}`)
      }
      expect(report.join('\n\n')).toBe('')
      await deskPage.context().close()
      await phonePage.context().close()
    })
  }
})

describe('keyboard', () => {
  it('reaches the main navigation and a page\'s primary action with Tab, each with a visible focus ring', async () => {
    const page = await app.openAs('builder', { path: '/builds' })
    await page.getByTestId('new-build').waitFor()
    const seen: { text: string; outline: string; shadow: string }[] = []
    for (let i = 0; i < 40 && !seen.some((s) => /New build/.test(s.text)); i++) {
      await page.keyboard.press('Tab')
      seen.push(await page.evaluate(() => {
        const el = document.activeElement as HTMLElement
        const css = getComputedStyle(el)
        return { text: el.innerText ?? '', outline: `${css.outlineStyle} ${css.outlineWidth}`, shadow: css.boxShadow }
      }))
    }
    expect(seen.map((s) => s.text)).toContain('Parts')
    const newBuild = seen.find((s) => /New build/.test(s.text))
    expect(newBuild).toBeDefined()
    for (const s of seen.filter((x) => /^(Parts|New build)/.test(x.text))) {
      expect(s.outline === 'none 0px' && s.shadow === 'none', `no focus ring on ${s.text}`).toBe(false)
    }
    await page.keyboard.press('Enter')
    await page.getByTestId('build-name').waitFor()
    await page.close()
  })
})
