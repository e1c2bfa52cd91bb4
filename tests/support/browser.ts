// Debian's Chromium driven by playwright-core: never a browser download.
import { mkdtempSync, mkdirSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { BASE } from './api'

export const SCREENSHOTS = join(import.meta.dirname, '../../test-results/screenshots')

export const CHROMIUM_FLAGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
]

export interface Session { context: BrowserContext, close: () => Promise<void> }

/** Every browser context open now, for the screenshots taken when a test fails (browser-setup.ts). */
export const openContexts = new Set<BrowserContext>()

export async function openBrowser(): Promise<Session> {
  const profile = mkdtempSync(join(tmpdir(), 'plumbline-chromium-'))
  mkdirSync(SCREENSHOTS, { recursive: true })
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_FLAGS,
    viewport: { width: 1280, height: 900 },
    baseURL: BASE,
  })
  openContexts.add(context)
  return {
    context,
    close: async () => {
      openContexts.delete(context)
      await context.close()
      rmSync(profile, { recursive: true, force: true })
    },
  }
}

/**
 * Open a page and wait until Vue has hydrated it (app/plugins/hydrated.client.ts):
 * a click before that submits a form as plain HTML, which the app never sees.
 */
export async function gotoReady(page: Page, path: string) {
  const response = await page.goto(path)
  await page.locator('html[data-hydrated]').waitFor({ state: 'attached' })
  return response
}

export async function signInThroughPage(page: Page, email: string, password: string) {
  await gotoReady(page, '/login')
  await page.getByLabel('E-mail address').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => !url.pathname.startsWith('/login'))
}
