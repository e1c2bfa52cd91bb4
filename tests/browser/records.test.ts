// Release tracking in Chromium: a viewer finds a failing cell on the board,
// opens its verification record and prints it to PDF (A4 and Letter; the text
// is read back with poppler's pdftotext); the owner proposes a deviation for
// the failing case from the run page; a verification engineer approves it on
// the Deviations page and sees the board cell turn to accepted.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { demoUser, signedIn, unique } from '../support/api'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'
import { hermiteSet, readySet } from '../support/sets'
import { freshMinor, submitTable, tableFromSet } from '../support/records'

let browser: Session
let setName = ''
let runId = 0
const version = `70.${freshMinor()}.0`
const tmp = mkdtempSync(join(tmpdir(), 'plumbline-record-'))

beforeAll(async () => {
  const qa = await signedIn('qa')
  const set = await readySet(qa, hermiteSet(unique('browser-record'), { name: `Record check ${unique('r')}` }))
  setName = set.name
  runId = await submitTable(qa, 'oscillite', version, set.id, await tableFromSet(qa, set.id, i => (i.n === '8' && i.x === '0.5' ? 'off' : null)))
  browser = await openBrowser()
})
afterAll(async () => {
  await browser?.close()
})

async function as(role: 'viewer' | 'owner' | 'qa'): Promise<Page> {
  await browser.context.clearCookies()
  const page = await browser.context.newPage()
  const u = demoUser(role)
  await signInThroughPage(page, u.email, u.password)
  return page
}

/** The board's cell for our version and set (the board filtered to that set). */
async function boardCell(page: Page) {
  await gotoReady(page, '/')
  await page.getByLabel('Reference set').selectOption({ label: setName })
  // one code shows all its versions; tests before this one may have added many
  await page.getByTestId('filter-code').selectOption('oscillite')
  const row = page.getByTestId('board-code-oscillite').locator('tr', { has: page.locator('th', { hasText: version }) })
  await row.waitFor()
  return row.locator('td [data-state]').first()
}

function pdfText(pdf: Buffer, name: string): string {
  const file = join(tmp, name)
  writeFileSync(file, pdf)
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
}

describe('verification record and deviations in the browser', () => {
  it('a viewer opens the record from a failing board cell and prints it to PDF', async () => {
    const page = await as('viewer')
    const cell = await boardCell(page)
    await expect.poll(() => cell.getAttribute('data-state')).toBe('failed')
    expect(await cell.innerText()).toBe('failed 1')
    await page.screenshot({ path: join(SCREENSHOTS, 'record-board-failing.png'), fullPage: true })
    await cell.click()
    await page.waitForURL(`**/runs/${runId}`)
    await page.getByTestId('run-record-link').click()
    await page.waitForURL(`**/records/oscillite/${version}`)
    await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe(`Oscillite ${version}`)
    await page.getByTestId('record-caution').waitFor()
    await page.screenshot({ path: join(SCREENSHOTS, 'record-page-1280.png'), fullPage: true })

    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await page.pdf({ format, printBackground: true })
      const text = pdfText(pdf, `record-${format}.pdf`)
      const flat = text.replace(/\s+/g, ' ')
      expect(flat).toContain('Verification record')
      expect(flat).toContain(`Oscillite ${version}`)
      expect(flat).toContain(setName)
      expect(flat).toContain('Failures (1)')
      expect(flat).toContain('n = 8, x = 0.5')
      expect(flat).toMatch(/does not replace an organisation's QA programme/)
      expect(flat).toContain('Not signed yet.')
      // no navigation chrome and no buttons in print
      expect(flat).not.toContain('Sign out')
      expect(flat).not.toContain('Export JSON')
      expect(flat).not.toMatch(/Signed in as/)
      // the record sets no page size of its own, so each paper size prints as asked
      const info = execFileSync('pdfinfo', [join(tmp, `record-${format}.pdf`)], { encoding: 'utf8' })
      expect(info).toMatch(format === 'A4' ? /Page size:\s+595\.\d+ x 841\.\d+|Page size:.*\(A4\)/ : /Page size:.*\(letter\)/)
    }
    await page.setViewportSize({ width: 390, height: 844 })
    await page.screenshot({ path: join(SCREENSHOTS, 'record-page-390.png'), fullPage: true })
    // wide tables scroll inside their own box; the page itself does not scroll sideways
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0)
    await page.close()
  })

  it('the owner proposes a deviation for the failing case from the run page', async () => {
    const page = await as('owner')
    await gotoReady(page, `/runs/${runId}`)
    await page.getByTestId('filter-verdict-fail').check()
    await expect.poll(() => page.getByTestId('case-total').innerText()).toBe('1')
    await page.getByTestId('case-expand').first().click()
    await page.setViewportSize({ width: 390, height: 844 })
    const wide = await page.evaluate(() => Array.from(document.querySelectorAll('body *')).filter(e => e.getBoundingClientRect().right > window.innerWidth + 1 && !e.closest('.overflow-x-auto')).map(e => `${e.tagName}.${e.className}`.slice(0, 120)))
    expect(wide).toEqual([])
    await page.setViewportSize({ width: 1280, height: 900 })
    await page.getByTestId('propose-case').click()
    const form = page.getByTestId('deviation-propose')
    await form.getByLabel('Reason').fill('Cancellation in the recurrence at n = 8; fixed in the next minor release.')
    await form.getByLabel(/Version label/).fill('99.0.0')
    await form.getByRole('button', { name: 'Propose' }).click()
    const card = page.locator('[data-deviation]').first()
    await card.waitFor()
    await expect.poll(() => card.locator('[data-deviation-state]').innerText()).toBe('proposed')
    expect(await card.innerText()).toContain('case n=8;x=0.5')
    await page.screenshot({ path: join(SCREENSHOTS, 'record-run-proposed.png'), fullPage: true })
    await page.close()
  })

  it('qa approves it on the Deviations page and the board cell turns to accepted', async () => {
    const page = await as('qa')
    await gotoReady(page, '/deviations?state=proposed')
    const card = page.locator('[data-deviation]', { hasText: 'Cancellation in the recurrence at n = 8' }).first()
    await card.waitFor()
    await card.getByTestId('deviation-comment').fill('Checked against the release plan; accepted until 99.0.0.')
    await card.getByTestId('deviation-approve').click()
    // settled, it leaves the list of proposed ones and shows among the approved
    await card.waitFor({ state: 'detached' })
    await gotoReady(page, '/deviations?state=approved')
    const approved = page.locator('[data-deviation]', { hasText: 'Cancellation in the recurrence at n = 8' }).first()
    await expect.poll(() => approved.locator('[data-deviation-state]').innerText()).toBe('approved')
    expect(await approved.innerText()).toContain('Checked against the release plan')
    await page.screenshot({ path: join(SCREENSHOTS, 'record-deviations-approved.png'), fullPage: true })
    const cell = await boardCell(page)
    await expect.poll(() => cell.getAttribute('data-state')).toBe('accepted')
    await page.screenshot({ path: join(SCREENSHOTS, 'record-board-accepted.png'), fullPage: true })
    await page.close()
  })
})
