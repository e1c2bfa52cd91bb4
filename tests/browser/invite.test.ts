// As admin: invite a user, open the Outbox, follow the link in the message the
// catcher received, choose the password, and sign in as the new user.
// Send again a message the worker gave up on. Screenshots of the Outbox and the
// set-password page for a person to look at.
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { sectionsFor } from '../../shared/domain/navigation'
import { demoUser, unique } from '../support/api'
import { plantGivenUpMail, waitForMail } from '../support/mail'
import { gotoReady, openBrowser, SCREENSHOTS, signInThroughPage, type Session } from '../support/browser'

let browser: Session
beforeAll(async () => {
  browser = await openBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('invitation through the pages', () => {
  it('invites, reads the mail on the Outbox page, sets the password by the link and signs in', async () => {
    const page = await browser.context.newPage()
    const a = demoUser('admin')
    await signInThroughPage(page, a.email, a.password)
    await gotoReady(page, '/admin')
    const email = `invited-${Date.now()}@example.test`
    await page.getByLabel('Name').fill('Nell Ashgrove')
    await page.getByLabel('E-mail address').fill(email)
    await page.getByLabel('Role', { exact: true }).selectOption('viewer')
    await page.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => page.getByRole('status').innerText()).toMatch(/Invited .*Outbox/)

    await page.getByRole('link', { name: 'Mail outbox' }).click()
    await page.getByRole('heading', { level: 1, name: 'Mail outbox' }).waitFor()
    const message = page.getByTestId('received-list').locator('li', { hasText: email })
    // the worker sends within a second or two; the page refreshes on request
    await expect.poll(async () => {
      await page.getByRole('button', { name: 'Refresh' }).click()
      return message.count()
    }, { timeout: 30_000 }).toBe(1)
    await expect.poll(() => page.getByTestId('outbox-table').locator('tr', { hasText: email }).innerText()).toMatch(/sent/)
    await message.locator('summary').click()
    const link = message.getByRole('link', { name: /\/set-password#token=/ })
    await link.waitFor()
    await page.screenshot({ path: join(SCREENSHOTS, 'outbox-1280.png'), fullPage: true })
    await message.getByRole('button', { name: 'HTML part' }).click()
    await message.locator('iframe').waitFor()
    await expect.poll(() => message.frameLocator('iframe').getByRole('link', { name: 'Choose your password' }).count()).toBe(1)
    await page.screenshot({ path: join(SCREENSHOTS, 'outbox-html-part-1280.png'), fullPage: true })
    await page.setViewportSize({ width: 390, height: 844 })
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0)
    await page.screenshot({ path: join(SCREENSHOTS, 'outbox-390.png'), fullPage: true })
    await page.setViewportSize({ width: 1280, height: 900 })
    await message.getByRole('button', { name: 'Text part' }).click()

    // the invitee opens the link in a browser that is not signed in
    await browser.context.clearCookies()
    await message.getByRole('link', { name: /\/set-password#token=/ }).click()
    await page.waitForURL(/\/set-password#token=/)
    await page.getByRole('heading', { level: 1, name: 'Choose your password' }).waitFor()
    await expect.poll(() => page.getByText(`For ${email}`).count()).toBe(1)
    await page.getByLabel('New password').fill('too-short')
    await page.getByLabel('The same again').fill('too-short')
    await page.getByRole('button', { name: 'Set password' }).click()
    await expect.poll(() => page.getByText('Use at least 10 characters.').count()).toBe(1)
    await page.getByLabel('New password').fill('nell-chose-this-1')
    await page.getByLabel('The same again').fill('nell-chose-this-1')
    await page.screenshot({ path: join(SCREENSHOTS, 'set-password-1280.png'), fullPage: true })
    await page.getByRole('button', { name: 'Set password' }).click()
    await expect.poll(() => page.getByTestId('password-set').innerText()).toMatch(/Your password is set/)
    await page.screenshot({ path: join(SCREENSHOTS, 'set-password-done-1280.png'), fullPage: true })

    await page.getByRole('link', { name: 'Go to sign-in' }).click()
    await signInThroughPage(page, email, 'nell-chose-this-1')
    await expect.poll(() => page.getByTestId('nav-wide').getByRole('link').allInnerTexts()).toEqual(sectionsFor('viewer').map(s => s.label))
    await expect.poll(() => page.getByRole('link', { name: 'Nell Ashgrove · viewer' }).count()).toBe(1)
    await page.close()
  })

  it('sends again, from the Outbox page, a message the worker gave up on', async () => {
    const subject = unique('Undelivered notice')
    await plantGivenUpMail(demoUser('owner').email, subject)
    const page = await browser.context.newPage()
    const a = demoUser('admin')
    await browser.context.clearCookies()
    await signInThroughPage(page, a.email, a.password)
    await gotoReady(page, '/admin/outbox')
    const row = page.getByTestId('outbox-table').locator('tr', { hasText: subject })
    await expect.poll(() => row.innerText()).toMatch(/failed[\s\S]*gave up after 8 attempts/)
    await page.screenshot({ path: join(SCREENSHOTS, 'outbox-given-up-1280.png'), fullPage: true })
    await row.getByRole('button', { name: `Send again: ${subject} to ${demoUser('owner').email}` }).click()
    await expect.poll(() => row.innerText()).toMatch(/queued|sent/)
    await waitForMail(m => m.subject === subject)
    await expect.poll(async () => {
      await page.getByRole('button', { name: 'Refresh' }).click()
      return row.innerText()
    }, { timeout: 30_000 }).toMatch(/sent/)
    expect(await row.getByRole('button', { name: /Send again/ }).count()).toBe(0)
    await page.close()
  })

  it('shows the API page in the product\'s own look', async () => {
    const page = await browser.context.newPage()
    const a = demoUser('qa')
    await browser.context.clearCookies()
    await signInThroughPage(page, a.email, a.password)
    await gotoReady(page, '/api')
    await page.locator('[data-operation="POST /api/runs"]').waitFor()
    expect(await page.locator('[data-operation]').count()).toBeGreaterThanOrEqual(15)
    await expect.poll(() => page.locator('[data-operation="POST /api/runs"]').innerText()).toMatch(/CI token of scope submit/)
    await page.screenshot({ path: join(SCREENSHOTS, 'api-top-1280.png') })
    await page.close()
  })

  it('says plainly when a link is not valid, and offers a new one', async () => {
    const page = await browser.context.newPage()
    await browser.context.clearCookies()
    await page.setViewportSize({ width: 390, height: 844 })
    await gotoReady(page, `/set-password#token=${'u'.repeat(43)}`)
    await expect.poll(() => page.getByTestId('link-problem').innerText()).toMatch(/not valid/)
    await page.screenshot({ path: join(SCREENSHOTS, 'set-password-bad-link-390.png'), fullPage: true })
    await gotoReady(page, '/login')
    await page.getByRole('link', { name: 'Forgot your password?' }).click()
    // the sign-in page has an "E-mail address" field too: wait until the new page is in place
    await page.getByRole('button', { name: 'Send the link' }).waitFor()
    await page.getByLabel('E-mail address').fill('nobody@example.test')
    await page.getByRole('button', { name: 'Send the link' }).click()
    await expect.poll(() => page.getByRole('status').innerText()).toMatch(/If this address has an account/)
    await page.close()
  })
})
