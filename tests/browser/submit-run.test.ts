// The main job end to end in Chromium: a qa engineer defines a small Hermite
// set through the API, submits an honest binary64 output table through the
// Submit page (file input, mapping preview, judge) and lands on the run; then
// the code owner opens the run, filters the failures and reads a digit diff.
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { demoUser, signedIn, unique } from '../support/api'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'

const N_VALUES = Array.from({ length: 11 }, (_, i) => 3 * i) // 0, 3, …, 30
const X_VALUES = Array.from({ length: 21 }, (_, i) => -5 + 0.5 * i) // -5, -4.5, …, 5 (exact in binary)

/** H_n(x) by the plain forward recurrence H_{k+1} = 2x H_k − 2k H_{k−1} in JS doubles, as a naive code would. */
function hermiteDouble(n: number, x: number): number {
  let prev = 1
  if (n === 0) return prev
  let cur = 2 * x
  for (let k = 1; k < n; k++) {
    const next = 2 * x * cur - 2 * k * prev
    prev = cur
    cur = next
  }
  return cur
}

/** What a solver writes: n, x as given, the value with 17 significant digits (round-trips binary64). */
function outputTable(): string {
  const lines = ['n,x,H_n(x)']
  for (const n of N_VALUES) {
    for (const x of X_VALUES) lines.push(`${n},${x},${hermiteDouble(n, x).toPrecision(17)}`)
  }
  return lines.join('\n') + '\n'
}

async function noSideScroll(page: Page) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
  expect(overflow).toBeLessThanOrEqual(0)
}

let browser: Session
let setId = 0
let setName = ''
let runPath = ''
let versionLabel = ''

beforeAll(async () => {
  const qa = await signedIn('qa')
  setName = `Browser check ${unique('h')}`
  const created = await qa.post<{ set: { id: number, state: string } }>('/api/reference-sets', {
    name: setName,
    slug: unique('browser-hermite'),
    functionId: 'hermite',
    convention: 'physicists',
    grid: { parts: [{ kind: 'range', axes: [
      { param: 'n', start: '0', stop: '30', step: '3' },
      { param: 'x', start: '-5', stop: '5', step: '0.5' },
    ] }] },
    targetDigits: 20,
    criterion: {
      format: 'binary64',
      tolerance: { kind: 'ulps', maxUlps: '2' },
      regions: [],
      zero: { below: '0', atol: '1e-300' },
      overflow: { signedInf: 'fail' },
      nan: { verdict: 'non_finite' },
    },
    source: 'Browser test: values certified by the in-house engine.',
  })
  expect(created.status, JSON.stringify(created.body)).toBe(201)
  setId = created.body.set.id
  // The worker computes the cases; wait for it as the form's progress bar would.
  let state = created.body.set.state
  for (let i = 0; i < 120 && state !== 'ready' && state !== 'failed'; i++) {
    await new Promise(r => setTimeout(r, 500))
    const got = await qa.get<{ set: { state: string } }>(`/api/reference-sets/${setId}`)
    state = got.body.set.state
  }
  expect(state).toBe('ready')
  browser = await openBrowser()
})

afterAll(async () => {
  await browser?.close()
})

describe('submit a table and read the run', () => {
  it('qa submits through the page: preview, mapping, verdict, error map', async () => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    const qa = demoUser('qa')
    await signInThroughPage(page, qa.email, qa.password)
    await gotoReady(page, '/submit')
    await expect.poll(() => page.title()).toBe('Submit · Plumbline')
    await expect.poll(() => page.getByTestId('caution').innerText()).toContain('not a substitute')

    await page.getByLabel('Code', { exact: true }).selectOption('oscillite')
    versionLabel = unique('9.9.0-check')
    await page.getByLabel('New version label').fill(versionLabel)
    await page.getByLabel('Commit id (optional)').fill('5f0c2d1e')
    await page.getByLabel('Compiler').fill('gfortran 13.2')
    await page.getByLabel('Flags').fill('-O2')
    await page.getByLabel('Reference set').selectOption(String(setId))
    await page.getByTestId('file-input').setInputFiles({ name: 'oscillite-hermite.csv', mimeType: 'text/csv', buffer: Buffer.from(outputTable()) })

    const preview = page.getByTestId('mapping-preview')
    await preview.waitFor()
    expect(await page.getByTestId('preview-format').innerText()).toMatch(/csv/i)
    // The suggested mapping, which the user confirms.
    expect(await page.getByTestId('map-n').inputValue()).toBe('n')
    expect(await page.getByTestId('map-x').inputValue()).toBe('x')
    expect(await page.getByTestId('map-value').inputValue()).toBe('H_n(x)')
    expect(await page.getByTestId('preview-rows').locator('tbody tr').count()).toBeGreaterThan(3)
    expect(await page.getByTestId('preview-errors').count()).toBe(0)
    await page.screenshot({ path: join(SCREENSHOTS, 'submit-mapping-1280.png'), fullPage: true })
    await page.setViewportSize({ width: 390, height: 844 })
    await noSideScroll(page)
    await page.screenshot({ path: join(SCREENSHOTS, 'submit-mapping-390.png'), fullPage: true })
    await preview.screenshot({ path: join(SCREENSHOTS, 'submit-mapping-390-preview.png') })
    await page.setViewportSize({ width: 1280, height: 900 })

    await page.getByTestId('judge').click()
    await page.waitForURL(/\/runs\/\d+$/, { timeout: 60_000 })
    runPath = new URL(page.url()).pathname

    const counts = page.getByTestId('run-counts')
    await counts.waitFor()
    const total = N_VALUES.length * X_VALUES.length
    await expect.poll(() => counts.innerText()).toContain(String(total))
    const passText = await counts.locator('[data-count="pass"]').innerText()
    const failText = await counts.locator('[data-count="fail"]').innerText()
    const pass = Number(passText.replace(/\D+/g, ''))
    const fail = Number(failText.replace(/\D+/g, ''))
    // The plain recurrence loses accuracy at large n and near zeros: some cases fail, most pass.
    expect(fail).toBeGreaterThan(0)
    expect(pass).toBeGreaterThan(0)
    expect(pass + fail).toBeLessThanOrEqual(total)

    const map = page.getByTestId('error-map')
    await map.waitFor()
    expect(await map.locator('g[role="button"]').count()).toBe(total)
    expect(await map.locator('g[role="button"][data-verdict="fail"]').count()).toBe(fail)
    await map.locator('g[role="button"][data-verdict="fail"]').first().hover()
    await expect.poll(() => page.getByTestId('error-map-tip').innerText()).toMatch(/x = .*n = .*log10 ULPs/s)
    expect(await page.getByTestId('caution').innerText()).toContain('licensed review')
    await page.mouse.move(0, 0)
    await page.screenshot({ path: join(SCREENSHOTS, 'run-qa-1280.png'), fullPage: true })
    await page.setViewportSize({ width: 390, height: 844 })
    await noSideScroll(page)
    await page.screenshot({ path: join(SCREENSHOTS, 'run-qa-390.png'), fullPage: true })
    await page.screenshot({ path: join(SCREENSHOTS, 'run-qa-390-top.png') })
    await page.close()
  })

  it('shows how much of the table has been sent, for the preview and for judging', async () => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    const qa = demoUser('qa')
    await signInThroughPage(page, qa.email, qa.password)
    await gotoReady(page, '/submit')
    await page.getByLabel('Code', { exact: true }).selectOption('oscillite')
    await page.getByLabel('New version label').fill(unique('9.9.1-slow'))
    await page.getByLabel('Reference set').selectOption(String(setId))
    // a slow line, so that sending the table takes a few seconds
    const cdp = await browser.context.newCDPSession(page)
    await cdp.send('Network.enable')
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 400_000 })
    // the same table behind 1.2 MB of comment lines, as a solver's log header might be
    const padding = Array.from({ length: 15_000 }, (_, i) => `# run log ${String(i).padStart(6, '0')}: ${'step completed '.repeat(4)}`).join('\n')
    const body = Buffer.from(`${padding}\n${outputTable()}`)
    expect(body.length).toBeGreaterThan(1_000_000)

    /** The progress values shown while `testId` is on the page, until `done` resolves. */
    async function watchProgress(testId: string, done: Promise<unknown>) {
      const seen: Array<{ sent: number, total: number, text: string }> = []
      let finished = false
      void done.finally(() => { finished = true })
      while (!finished) {
        const bar = page.getByTestId(testId)
        if (await bar.count()) {
          const [sent, total, text] = await Promise.all([bar.getAttribute('data-sent'), bar.getAttribute('data-total'), bar.innerText()]).catch(() => [null, null, ''])
          if (sent !== null && total !== null) {
            seen.push({ sent: Number(sent), total: Number(total), text: text ?? '' })
            // a picture of the bar partway, for a person to look at
            if (seen.length === 3) await bar.screenshot({ path: join(SCREENSHOTS, `submit-${testId}-partway.png`) }).catch(() => {})
          }
        }
        await new Promise(r => setTimeout(r, 100))
      }
      return seen
    }

    await page.getByTestId('file-input').setInputFiles({ name: 'slow.csv', mimeType: 'text/csv', buffer: body })
    const previewSeen = await watchProgress('preview-busy', page.getByTestId('mapping-preview').waitFor({ timeout: 60_000 }))
    const partway = previewSeen.filter(p => p.sent > 0 && p.sent < p.total)
    expect(partway.length, JSON.stringify(previewSeen.slice(0, 5))).toBeGreaterThan(0)
    expect(partway[0]!.text).toMatch(/Sending the table to read its columns · \d+ % \(\d\.\d of 1\.\d MB\)/)
    await page.screenshot({ path: join(SCREENSHOTS, 'submit-preview-sent-1280.png') })

    await page.getByTestId('judge').click()
    const judgeSeen = await watchProgress('judge-progress', page.waitForURL(/\/runs\/\d+$/, { timeout: 60_000 }))
    expect(judgeSeen.some(p => p.sent > 0 && p.sent < p.total)).toBe(true)
    const sentValues = judgeSeen.map(p => p.sent)
    expect(sentValues).toEqual([...sentValues].sort((a, b) => a - b))
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 })
    await page.close()
  })

  it('the same file, dropped on the zone, for the same version and set is recognised, not judged twice', async () => {
    expect(runPath).toMatch(/^\/runs\/\d+$/)
    const page = await browser.context.newPage()
    await gotoReady(page, '/submit')
    await page.getByLabel('Code', { exact: true }).selectOption('oscillite')
    await page.getByLabel('an existing version').check()
    await page.getByLabel('Which existing version').selectOption(versionLabel)
    await page.getByLabel('Reference set').selectOption(String(setId))
    // this time the file is dragged onto the drop zone rather than picked
    const dropped = await page.evaluateHandle((text) => {
      const dt = new DataTransfer()
      dt.items.add(new File([text], 'oscillite-hermite.csv', { type: 'text/csv' }))
      return dt
    }, outputTable())
    const zone = page.getByTestId('drop-zone')
    await zone.dispatchEvent('dragenter', { dataTransfer: dropped })
    await zone.dispatchEvent('dragover', { dataTransfer: dropped })
    await zone.dispatchEvent('drop', { dataTransfer: dropped })
    await page.getByTestId('mapping-preview').waitFor()
    await page.getByTestId('judge').click()
    const dup = page.getByTestId('judge-duplicate')
    await dup.waitFor()
    expect(await dup.getByRole('link').getAttribute('href')).toBe(runPath)
    expect(new URL(page.url()).pathname).toBe('/submit')
    await page.close()
  })

  it('the code owner filters the failures and reads a digit diff', async () => {
    expect(runPath).toMatch(/^\/runs\/\d+$/)
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    const owner = demoUser('owner')
    await signInThroughPage(page, owner.email, owner.password)
    await gotoReady(page, runPath)
    const table = page.getByTestId('case-table')
    await table.waitFor()
    const failCount = Number((await page.getByTestId('run-counts').locator('[data-count="fail"]').innerText()).replace(/\D+/g, ''))

    // Choosing a failed cell on the map names the case and offers its verdict as a filter.
    await page.getByTestId('error-map').locator('g[role="button"][data-verdict="fail"]').first().click()
    await expect.poll(() => page.getByTestId('map-picked').innerText()).toMatch(/n = \d+.*fail/s)
    await page.getByTestId('filter-verdict-fail').check()
    await expect.poll(() => page.getByTestId('case-total').innerText()).toBe(String(failCount))
    const verdictCells = table.locator('tbody [data-verdict]')
    await expect.poll(async () => [...new Set(await verdictCells.evaluateAll(els => els.map(e => e.getAttribute('data-verdict'))))]).toEqual(['fail'])

    // Worst first, then open the first case's digits.
    await page.getByTestId('sort-ulps').click()
    await page.getByTestId('sort-ulps').click()
    await expect.poll(() => page.getByTestId('sort-ulps').locator('xpath=..').getAttribute('aria-sort')).toBe('descending')
    await expect.poll(() => table.locator('[aria-busy]').getAttribute('aria-busy')).toBe('false')
    const ulps = await table.locator('tbody tr[data-case] td:nth-last-child(3)').allInnerTexts()
    const ulpNumbers = ulps.map(t => Number(t.replace('×10', 'e').replace(/\s/g, '')))
    expect(ulpNumbers).toEqual([...ulpNumbers].sort((a, b) => b - a))
    await table.getByTestId('case-expand').first().click()
    const diff = table.getByTestId('digit-diff')
    await diff.waitFor()
    const measured = await diff.getByTestId('digit-diff-measured').innerText()
    const reference = await diff.getByTestId('digit-diff-reference').innerText()
    expect(measured).toMatch(/^[+-]\d\.\d+$/)
    expect(reference).toMatch(/^[+-]\d\.\d+$/)
    expect(measured).not.toBe(reference)
    expect(await diff.locator('[data-differs="true"]').count()).toBeGreaterThan(0)
    await expect.poll(() => diff.innerText()).toMatch(/leaves the reference|part at the first digit/)
    await page.screenshot({ path: join(SCREENSHOTS, 'run-owner-failures-1280.png'), fullPage: true })
    await page.setViewportSize({ width: 390, height: 844 })
    await noSideScroll(page)
    await page.screenshot({ path: join(SCREENSHOTS, 'run-owner-failures-390.png'), fullPage: true })
    // Close-ups at 390 px of the parts that are hard to read in a full-page shot.
    await page.getByTestId('run-counts').screenshot({ path: join(SCREENSHOTS, 'run-owner-390-counts.png') })
    await page.getByTestId('error-map').locator('xpath=..').screenshot({ path: join(SCREENSHOTS, 'run-owner-390-map.png') })
    await diff.screenshot({ path: join(SCREENSHOTS, 'run-owner-390-diff.png') })
    await table.locator('tbody').screenshot({ path: join(SCREENSHOTS, 'run-owner-390-rows.png') })
    await page.getByTestId('run-worst').screenshot({ path: join(SCREENSHOTS, 'run-owner-390-worst.png') })
    await table.locator('form').screenshot({ path: join(SCREENSHOTS, 'run-owner-390-filters.png') })
    await page.close()
  })
})
