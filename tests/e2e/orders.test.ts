import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { useBrowserSuite } from '../helpers/browser-suite'
import { DESKTOP, PHONE, screenshot } from '../helpers/browser'
import { parseMail } from '../helpers/mail'
import { startMailSink, type MailSink } from '../../server/services/mail-sink'
import { demoUser } from '../helpers/app'

/** The valve chest gasket of the demo: 3 in stock, reorder point 4, so low from the start. */
const PART = 'GSK-0.25-PAP'
let sink: MailSink
beforeAll(async () => { sink = await startMailSink() })
afterAll(async () => { await sink?.close() })
// Registered after the sink's hooks, so the server starts after it and stops before it.
const app = useBrowserSuite(() => ({ SMTP_HOST: sink.host, SMTP_PORT: String(sink.port) }))

describe('from the low-stock e-mail to received goods, in Chromium', () => {
  let ordersLink = ''

  it('sends the alert digest to the storekeeper when asked', async () => {
    const page = await app.openAs('storekeeper', { path: '/orders' })
    await page.getByTestId('send-digest').click()
    await sink.waitFor(1, 20_000)
    const mail = parseMail(sink.messages[0].raw)
    expect(sink.messages[0].to).toEqual([demoUser('storekeeper').email])
    expect(mail.text).toContain(`${PART} Valve chest gasket 0.25 mm, gasket paper: 3 pcs available (on hand 3, reserved 0), reorder point 4`)
    ordersLink = /(http:\/\/\S+\/orders\?suggest=1)/.exec(mail.text)![1]
    expect(ordersLink).toMatch(/^http:\/\/localhost:\d+\/orders\?suggest=1$/)
    await page.close()
  })

  it('opens the e-mail link signed out, signs in, and finds the part among the suggestions', async () => {
    const context = await app.browser.newContext({ viewport: DESKTOP })
    const page = await context.newPage()
    await page.goto(ordersLink)
    await page.waitForURL((u) => u.pathname === '/login')
    await page.getByTestId('username').fill('keeper')
    await page.locator('input[type="password"]').fill(demoUser('storekeeper').password)
    await page.getByTestId('sign-in').click()
    await page.waitForURL((u) => u.pathname === '/orders' && u.searchParams.get('suggest') === '1')
    const group = page.locator('[data-testid^="suggestions-"]', { hasText: PART })
    await group.waitFor()
    await expect.poll(() => group.locator('tr', { hasText: PART }).count()).toBe(1)
    await screenshot(page, 'orders-suggestions')

    await group.getByTestId('create-draft').click()
    await page.waitForURL((u) => u.searchParams.has('order'))
    await expect.poll(() => page.getByTestId('order-status').innerText()).toBe('draft')
    await screenshot(page, 'orders-draft')

    await page.getByTestId('send-order').click()
    await page.getByRole('button', { name: 'Send the order' }).click()
    await expect.poll(() => page.getByTestId('order-status').innerText(), { timeout: 20_000 }).toBe('sent')
    await sink.waitFor(2, 20_000)
    const order = parseMail(sink.messages[1].raw)
    expect(sink.messages[1].to).toEqual(['orders@wyvern-models.example'])
    expect(order.subject).toMatch(/^Purchase order PO-0002 from /)
    expect(order.text).toContain(`(our code ${PART}): 10 pack(s) of 1 pcs at 0.30 a pack = 3.00`)
    expect(order.attachments.map((a) => a.filename)).toEqual(['PO-0002.pdf'])

    await page.getByTestId('receive-order').click()
    await page.getByRole('button', { name: 'Receive into stock' }).click()
    await expect.poll(() => page.getByTestId('order-status').innerText(), { timeout: 20_000 }).toBe('received')
    await expect.poll(() => page.getByTestId(`received-${PART}`).innerText()).toBe('10')
    await screenshot(page, 'orders-received')

    await page.goto(`${new URL(ordersLink).origin}/`)
    await page.getByTestId('today-low').waitFor()
    await expect.poll(() => page.getByTestId('today-low').innerText()).not.toContain(PART)
    expect(await page.locator('.page').innerText()).not.toContain(PART)
    await screenshot(page, 'today-after-order')
    await context.close()
  })

  it('shows Today to a builder on a phone, without order links', async () => {
    const page = await app.openAs('builder', { viewport: PHONE })
    await page.getByTestId('today-expiry').waitFor()
    expect(await page.locator('a[href^="/orders"]').count()).toBe(0)
    await screenshot(page, 'today-builder-phone')
    await page.close()
  })
})
