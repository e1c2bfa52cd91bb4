// Every page renders at 1280 px and at 390 px without sideways scrolling.
// Screenshots of each go to test-results/screenshots for a person to look at.
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoUser } from '../support/api'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'

const PAGES = [
  { path: '/', name: 'board', heading: 'Board' },
  { path: '/codes', name: 'codes', heading: 'Codes' },
  { path: '/codes/oscillite', name: 'code', heading: 'Oscillite' },
  { path: '/codes/oscillite/compare', name: 'compare', heading: 'Compare versions' },
  { path: '/audit', name: 'audit', heading: 'Audit trail' },
  { path: '/reference-sets', name: 'reference-sets', heading: 'Reference sets' },
  { path: '/submit', name: 'submit', heading: 'Submit an output table' },
  { path: '/admin', name: 'admin', heading: 'Admin' },
  { path: '/admin/outbox', name: 'outbox', heading: 'Mail outbox' },
  { path: '/api', name: 'api', heading: 'API' },
  { path: '/account', name: 'account', heading: 'Account' },
]

let browser: Session
beforeAll(async () => {
  browser = await openBrowser()
  const page = await browser.context.newPage()
  const a = demoUser('admin')
  await signInThroughPage(page, a.email, a.password)
  await page.close()
})
afterAll(async () => {
  await browser?.close()
})

describe('pages at both widths', () => {
  const cases = PAGES.flatMap(p => [1280, 390].map(w => [p.path, w, p] as const))
  it.each(cases)('%s at %i px', async (_path, width, p) => {
    const page = await browser.context.newPage()
    await page.setViewportSize({ width, height: 900 })
    await gotoReady(page, p.path)
    await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe(p.heading)
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
    expect(overflow).toBeLessThanOrEqual(0)
    await page.screenshot({ path: join(SCREENSHOTS, `page-${p.name}-${width}.png`), fullPage: true })
    await page.close()
  })

  it('shows the sign-in page and its caution at 390 px', async () => {
    const page = await browser.context.newPage()
    await page.context().clearCookies()
    await page.setViewportSize({ width: 390, height: 844 })
    await gotoReady(page, '/login')
    await expect.poll(() => page.getByText(/does not replace your\s+organisation's QA programme/).count()).toBe(1)
    await page.screenshot({ path: join(SCREENSHOTS, 'page-login-390.png'), fullPage: true })
    await page.close()
  })
})
