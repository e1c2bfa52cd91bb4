// Each role signs in through the real page and sees only the sections it may
// use, at 1280 px and at 390 px wide. Screenshots go to test-results/screenshots.
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ROLES } from '../../shared/domain/enums'
import { demoUser } from '../support/api'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'

const EXPECTED: Record<string, string[]> = {
  admin: ['Board', 'Reference sets', 'Codes', 'Deviations', 'Submit', 'Audit trail', 'Admin'],
  qa: ['Board', 'Reference sets', 'Codes', 'Deviations', 'Submit'],
  owner: ['Board', 'Reference sets', 'Codes', 'Deviations'],
  viewer: ['Board', 'Reference sets', 'Codes', 'Deviations', 'Audit trail'],
}

let browser: Session
beforeAll(async () => {
  browser = await openBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('navigation by role', () => {
  it.each(ROLES)('%s sees the sections of that role, wide and narrow', async (role) => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    const u = demoUser(role)
    await signInThroughPage(page, u.email, u.password)
    await expect.poll(() => page.title()).toBe('Board · Plumbline')

    const wide = page.getByTestId('nav-wide')
    await expect.poll(() => wide.getByRole('link').allInnerTexts()).toEqual(EXPECTED[role])
    await page.getByTestId('board-code-oscillite').waitFor()
    await page.screenshot({ path: join(SCREENSHOTS, `board-${role}-1280.png`), fullPage: true })

    await page.setViewportSize({ width: 390, height: 844 })
    await page.getByRole('button', { name: 'Menu' }).click()
    const narrow = page.getByTestId('nav-narrow')
    await narrow.waitFor()
    expect(await narrow.locator('li[data-section] > a').allInnerTexts()).toEqual(EXPECTED[role])
    await page.screenshot({ path: join(SCREENSHOTS, `board-${role}-390.png`), fullPage: true })
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
    expect(overflow).toBeLessThanOrEqual(0)
    await page.close()
  })

  it('keeps a viewer out of the admin page and sends anonymous visitors to sign in', async () => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    await gotoReady(page, '/admin')
    await page.waitForURL(/\/login\?next=(%2F|\/)admin/)
    const u = demoUser('viewer')
    await page.getByLabel('E-mail address').fill(u.email)
    await page.getByLabel('Password').fill(u.password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(async () => page.getByRole('heading', { level: 1 }).innerText()).toBe('Not for your role')
    await page.close()
  })

  it('shows the server message on a wrong password', async () => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    await gotoReady(page, '/login')
    await page.getByLabel('E-mail address').fill(demoUser('qa').email)
    await page.getByLabel('Password').fill('not-the-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect.poll(() => page.getByTestId('login-error').innerText()).toMatch(/wrong/)
    await page.close()
  })

  it('lets an admin invite a user, naming a bad field first', async () => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    const a = demoUser('admin')
    await signInThroughPage(page, a.email, a.password)
    await gotoReady(page, '/admin')
    const email = `browser-${Date.now()}@example.test`
    await page.getByLabel('Name').fill('Browser Person')
    await page.getByLabel('E-mail address').fill('not-an-address')
    await page.getByLabel('Role', { exact: true }).selectOption('owner')
    await page.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => page.getByText('Enter a valid e-mail address.').count()).toBe(1)
    await page.getByLabel('E-mail address').fill(email)
    await page.getByRole('button', { name: 'Send invitation' }).click()
    await page.getByTestId('users-table').getByRole('cell', { name: email, exact: true }).waitFor()
    await page.screenshot({ path: join(SCREENSHOTS, 'admin-1280.png'), fullPage: true })
    await page.close()
  })
})
