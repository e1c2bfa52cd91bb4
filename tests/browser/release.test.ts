// Release tracking in Chromium, as a viewer: the board cell opens its run, the
// code page's trend chart answers a hover with the values, and the compare
// page gives the release-notes line. Two versions are judged through the API
// first, on a set of their own. Screenshots go to test-results/screenshots.
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { demoUser, signedIn, unique } from '../support/api'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'
import { hermiteDouble, hermiteSet, readySet, upload } from '../support/sets'

const NS = [0, 4, 8, 12]
const XS = ['-1', '-0.5', '0', '0.5', '1']
const table = (off: string[]) => ['n,x,H', ...NS.flatMap(n => XS.map((x) => {
  const v = hermiteDouble(n, Number(x))
  return `${n},${x},${(off.includes(`${n},${x}`) ? v * (1 + 1e-6) : v).toPrecision(17)}`
}))].join('\n') + '\n'

const major = 100 + Math.floor(Math.random() * 800000)
const older = `${major}.0.0`
const newer = `${major}.1.0`
let slug = ''
let newerRun = 0
let browser: Session

async function noSideScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0)
}

beforeAll(async () => {
  const qa = await signedIn('qa')
  const set = await readySet(qa, hermiteSet(unique('h-browser-release')))
  slug = set.slug
  for (const [version, off] of [[older, ['4,0.5']], [newer, ['8,1', '12,-1']]] as const) {
    const r = await upload(qa, '/api/runs', { code: 'oscillite', version, setId: String(set.id) }, { name: `${version}.csv`, content: table([...off]) })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    newerRun = r.body.run.id
  }
  browser = await openBrowser()
  const page = await browser.context.newPage()
  const v = demoUser('viewer')
  await signInThroughPage(page, v.email, v.password)
  await page.close()
})
afterAll(async () => {
  await browser?.close()
})

describe('release tracking pages', () => {
  it('opens the run from its board cell, and marks the regression', async () => {
    const page = await browser.context.newPage()
    await gotoReady(page, '/')
    await page.getByTestId('filter-code').selectOption('oscillite')
    await page.getByTestId('filter-set').selectOption(slug)
    const cell = page.locator(`[data-cell="${newer}:${slug}"]`)
    await expect.poll(() => cell.innerText()).toMatch(/failed 2/)
    expect(await cell.locator('[data-regression]').count()).toBe(1)
    expect(await page.locator(`[data-cell="${older}:${slug}"]`).innerText()).toMatch(/failed 1/)
    await page.screenshot({ path: join(SCREENSHOTS, 'release-board-1280.png'), fullPage: true })
    await cell.getByRole('link').click()
    await page.waitForURL(new RegExp(`/runs/${newerRun}$`))
    await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toMatch(new RegExp(`Run ${newerRun}`))
    expect(await page.getByText(/Regression:/).count()).toBe(1)
    await page.close()
  })

  it('shows the trend chart with values on hover, and when each current failure began, at both widths', async () => {
    for (const width of [1280, 390]) {
      const page = await browser.context.newPage()
      await page.setViewportSize({ width, height: 900 })
      await gotoReady(page, `/codes/oscillite?at=${newer}`)
      const chart = page.getByTestId('trend-chart')
      await chart.waitFor()
      await chart.locator(`rect[data-version="${newer}"]`).hover()
      const tip = page.getByTestId('trend-tip')
      await expect.poll(() => tip.innerText()).toContain(newer)
      expect(await tip.innerText()).toMatch(/e-\d+ \/ /)
      const mine = page.getByTestId(`failures-${slug}`)
      await expect.poll(() => mine.getByTestId('failures-by-first').innerText()).toContain(`2 failing since ${newer}`)
      await noSideScroll(page)
      await page.screenshot({ path: join(SCREENSHOTS, `release-code-${width}.png`), fullPage: true })
      await page.close()
    }
  })

  it('compares the two versions with the largest regression first and a line for release notes', async () => {
    for (const width of [1280, 390]) {
      const page = await browser.context.newPage()
      await page.setViewportSize({ width, height: 900 })
      await gotoReady(page, `/codes/oscillite/compare?from=${older}&to=${newer}&set=${slug}`)
      const summary = page.getByTestId('compare-summary')
      await expect.poll(() => summary.innerText()).toContain(`Oscillite ${newer} against ${older}`)
      expect(await summary.innerText()).toContain('2 newly failing, 1 fixed, 0 still failing')
      const kinds = await page.locator('[data-testid="compare-table"] tbody tr').evaluateAll(rows => rows.slice(0, 3).map(r => r.getAttribute('data-kind')))
      expect(kinds).toEqual(['newly-failing', 'newly-failing', 'same'])
      await page.getByTestId('kind-fixed').check()
      await expect.poll(() => page.locator('[data-testid="compare-table"] tbody tr').count()).toBe(1)
      await noSideScroll(page)
      await page.screenshot({ path: join(SCREENSHOTS, `release-compare-${width}.png`), fullPage: true })
      await page.close()
    }
  })
})
