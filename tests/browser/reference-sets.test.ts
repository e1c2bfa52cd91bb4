// A qa engineer defines a small Hermite set in the browser: a bad field is
// marked beside itself, the preview shows reference values, saving computes
// the set with visible progress, cases page, and the CSV download has a row
// per case. A viewer then reads the set without any edit controls.
// Screenshots of the form and the set page at 1280 and 390 px.
import { join } from 'node:path'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoUser, unique } from '../support/api'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'

let qa: Session
let viewer: Session
let setPath = ''
const name = `Hermite tail check ${unique('b')}`

beforeAll(async () => {
  qa = await openBrowser()
  viewer = await openBrowser()
})
afterAll(async () => {
  await qa?.close()
  await viewer?.close()
})

const noSideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)

async function shoot(page: Page, stem: string) {
  for (const width of [1280, 390]) {
    await page.setViewportSize({ width, height: 900 })
    await page.waitForTimeout(150)
    expect(await noSideways(page), `${stem} at ${width} px scrolls sideways`).toBeLessThanOrEqual(0)
    await page.screenshot({ path: join(SCREENSHOTS, `${stem}-${width}.png`), fullPage: true })
  }
  await page.setViewportSize({ width: 1280, height: 900 })
}

describe('reference sets in the browser', () => {
  it('qa fills the form, sees a field issue, previews and saves', async () => {
    const page = await qa.context.newPage()
    const u = demoUser('qa')
    await signInThroughPage(page, u.email, u.password)
    await gotoReady(page, '/reference-sets')
    await page.getByRole('link', { name: 'New reference set' }).click()
    await page.waitForURL('**/reference-sets/new')
    await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('New reference set')

    await page.getByLabel('Name', { exact: true }).fill(name)
    expect(await page.getByLabel('Slug').inputValue()).toMatch(/^hermite-tail-check-b-/)
    expect(await page.getByTestId('function-card').innerText()).toContain('H_n(x)')
    for (const [f, v] of [['n start', '0'], ['n stop', '20'], ['n step', '5'], ['x start', '-2'], ['x stop', '2'], ['x step', 'half']]) {
      await page.getByLabel(f!, { exact: true }).fill(v!)
    }
    await page.getByLabel('Target certified digits').fill('30')
    await page.locator('#crit-format').selectOption('binary64')
    await page.locator('#crit-tol-kind').selectOption('ulps')
    await page.locator('#crit-tol-maxUlps').fill('4')

    // A bad step is refused in the browser, beside its field.
    await page.getByRole('button', { name: 'Preview' }).click()
    await expect.poll(() => page.locator('#gp0-a1-step-error').innerText()).toContain('Enter a decimal number')
    expect(await page.locator('#gp0-a1-step').getAttribute('aria-invalid')).toBe('true')
    await page.getByLabel('x step', { exact: true }).fill('0.5')
    await expect.poll(() => page.locator('#gp0-a1-step-error').count()).toBe(0)

    // A degree past the catalogue's domain passes the schema; the server's 400 lands on the grid part.
    await page.getByLabel('n stop', { exact: true }).fill('30000')
    await page.getByRole('button', { name: 'Preview' }).click()
    await expect.poll(() => page.getByTestId('grid-part-0').getByRole('alert').count(), { timeout: 20_000 }).toBe(1)
    expect(await page.getByTestId('grid-part-0').getByRole('alert').innerText()).toMatch(/\bn\b/)
    await shoot(page, 'reference-set-form-server-issue')
    await page.getByLabel('n stop', { exact: true }).fill('20')

    // The other part kinds: a random box, and pasted points where one line lacks its x.
    await page.getByRole('button', { name: 'Add random box' }).click()
    await page.locator('#gp1-count').fill('')
    await page.getByRole('button', { name: 'Add explicit points' }).click()
    await page.locator('#gp2-points').fill('25,0.5\n30')
    await page.getByRole('button', { name: 'Preview' }).click()
    await expect.poll(() => page.locator('#gp2-points-error').innerText()).toContain('Line 2 has 1 value; expected 2 (n, x)')
    expect(await page.locator('#gp1-count-error').innerText()).toBe('Enter a whole number.')
    expect(await page.getByTestId('form-issues').innerText()).toMatch(/2 fields need attention/)
    await shoot(page, 'reference-set-form-issues')
    await page.getByTestId('grid-part-2').getByRole('button', { name: 'Remove part' }).click()
    await page.getByTestId('grid-part-1').getByRole('button', { name: 'Remove part' }).click()
    await expect.poll(() => page.getByTestId('form-issues').count()).toBe(0)

    // A looser bound in the tails, past the oscillatory range |x| > sqrt(2n+1).
    await page.getByRole('button', { name: 'Add region' }).click()
    await page.locator('#reg-0-name').fill('tail')
    await page.locator('#reg-0-c0-param').selectOption('x')
    await page.locator('#reg-0-c0-op').selectOption('absGreaterThan')
    await page.locator('#reg-0-c0-value').fill('sqrt(2*n+1)')
    await page.locator('#reg-0-tol-kind').selectOption('ulps')
    await page.locator('#reg-0-tol-maxUlps').fill('64')
    await page.getByLabel('a fail').check()
    await page.getByLabel('Source').fill('Invented acceptance test for the browser suite.')

    await page.getByRole('button', { name: 'Preview' }).click()
    const preview = page.getByTestId('preview')
    await preview.waitFor({ timeout: 30_000 })
    const text = await preview.innerText()
    // n ∈ {0,5,10,15,20} × x ∈ {−2, −1.5, …, 2}: 5 × 9 cases; only n = 0 has |x| > 1 (four of them).
    expect(text).toMatch(/45\s+cases in the grid/)
    expect(text).toMatch(/tail\s+4/)
    expect(text).toMatch(/all\s+41/)
    expect(await preview.getByTestId('case-table').locator('tbody tr').count()).toBeGreaterThan(0)
    await shoot(page, 'reference-set-form')

    await page.getByRole('button', { name: 'Save', exact: true }).click()
    await page.waitForURL(/\/reference-sets\/\d+$/, { timeout: 30_000 })
    setPath = new URL(page.url()).pathname
    await page.close()
  })

  it('the set page shows progress until ready, pages the cases and downloads CSV', async () => {
    const page = await qa.context.newPage()
    await gotoReady(page, setPath)
    await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe(name)
    // The bar or the ready mark: progress is shown until the worker finishes.
    await expect.poll(() => page.locator('[data-testid="set-progress"], [data-state="ready"], [data-testid="set-error"]').count()).toBeGreaterThan(0)
    await expect.poll(() => page.locator('[data-state="ready"]').count(), { timeout: 60_000, interval: 500 }).toBe(1)
    const words = await page.getByTestId('criterion-words').innerText()
    expect(words).toContain('within 4 ULPs of r in binary64')
    expect(words).toContain('|x| > sqrt(2*n+1)')
    expect(words).toContain('within 64 ULPs')
    expect(await page.getByTestId('set-definition').innerText()).toContain('still counts as a fail')

    await expect.poll(() => page.getByTestId('case-page').innerText()).toContain('Page 1 of 1 · 45 cases')
    await page.getByLabel('Per page').selectOption('25')
    await expect.poll(() => page.getByTestId('case-page').innerText()).toContain('Page 1 of 2')
    await page.getByRole('button', { name: 'Next' }).click()
    await expect.poll(() => page.getByTestId('case-page').innerText()).toContain('Page 2 of 2')
    await expect.poll(() => page.getByTestId('case-table').locator('tbody tr').count()).toBe(20)
    expect(await page.getByTestId('case-table').locator('tbody tr').first().locator('td').first().innerText()).toBe('25') // ordinals count from 0

    await page.getByLabel('Significant digits').fill('20')
    const href = await page.getByTestId('download-csv').getAttribute('href')
    expect(href).toContain('digits=20')
    const res = await page.request.get(href!)
    expect(res.status()).toBe(200)
    const lines = (await res.text()).trimEnd().split('\n')
    expect(lines[0]).toMatch(/^n,x,value,digits/)
    expect(lines).toHaveLength(46)
    await shoot(page, 'reference-set-page')
    await page.close()
  })

  it('edit as new revision opens the form filled in and saves revision 2', async () => {
    const page = await qa.context.newPage()
    await gotoReady(page, setPath)
    await page.getByRole('link', { name: 'Edit as new revision' }).click()
    await page.waitForURL(/\/reference-sets\/new\?from=\d+/)
    await expect.poll(() => page.getByLabel('Name', { exact: true }).inputValue()).toBe(name)
    expect(await page.locator('#reg-0-c0-value').inputValue()).toBe('sqrt(2*n+1)')
    await page.locator('#reg-0-tol-maxUlps').fill('32')
    await page.getByRole('button', { name: 'Save revision 2' }).click()
    await page.waitForURL(url => /\/reference-sets\/\d+$/.test(url.pathname) && url.pathname !== setPath, { timeout: 30_000 })
    await expect.poll(() => page.locator('body').innerText()).toContain('Revision 2')
    expect(await page.getByRole('link', { name: 'r1' }).getAttribute('href')).toBe(setPath)

    // The slug is taken now: the server's 409 names the slug field.
    await gotoReady(page, '/reference-sets/new')
    await page.getByLabel('Name', { exact: true }).fill(name)
    await page.getByRole('button', { name: 'Save', exact: true }).click()
    await expect.poll(() => page.locator('#set-slug-error').innerText()).toContain('taken')
    await page.close()
  })

  it('a viewer sees the set but no new or edit controls', async () => {
    const page = await viewer.context.newPage()
    const u = demoUser('viewer')
    await signInThroughPage(page, u.email, u.password)
    await gotoReady(page, '/reference-sets')
    await expect.poll(() => page.getByTestId('sets-table').innerText()).toContain(name)
    expect(await page.getByRole('link', { name: 'New reference set' }).count()).toBe(0)
    expect(await page.getByTestId('sets-table').getByRole('link', { name }).getAttribute('href')).toMatch(/^\/reference-sets\/\d+$/)
    await shoot(page, 'reference-sets-index-viewer')
    await gotoReady(page, setPath)
    await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe(name)
    expect(await page.getByRole('link', { name: 'Edit as new revision' }).count()).toBe(0)
    expect(await page.getByTestId('set-definition').innerText()).toContain('H_n(x)')
    await page.close()
  })
})
