// Browser project setup: when a test fails, keep a screenshot of every open
// page and print what each says in its alerts, so a failure in CI can be read
// afterwards (test-results/screenshots/failed-*.png).
import { join } from 'node:path'
import { beforeEach } from 'vitest'
import { openContexts, SCREENSHOTS } from './browser'

beforeEach(({ task, onTestFailed }) => {
  onTestFailed(async () => {
    const name = task.name.replace(/[^\w]+/g, '-').slice(0, 60)
    let i = 0
    for (const context of openContexts) {
      for (const page of context.pages().filter(p => p.url() !== 'about:blank')) {
        const file = join(SCREENSHOTS, `failed-${name}-${i++}.png`)
        await page.screenshot({ path: file, fullPage: true, timeout: 5000 }).catch(() => {})
        const alerts = await page.locator('[role="alert"]').allInnerTexts().catch(() => [] as string[])
        console.log(`[failed test] ${page.url()} → ${file}${alerts.length ? `; alerts: ${alerts.join(' | ')}` : ''}`)
      }
    }
  })
})
