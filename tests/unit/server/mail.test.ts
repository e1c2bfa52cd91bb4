// Mail building blocks without a server: both parts say the same, the HTML
// escapes what people typed, and retry waits double up to their cap.
import { describe, expect, it } from 'vitest'
import { mailSettings, retryDelayMs } from '../../../server/mail/config'
import { compose } from '../../../server/mail/templates'

describe('compose', () => {
  const m = compose('test', 'a@example.test', 'Subject <b>', {
    greeting: 'Hello <script>alert(1)</script> & co,',
    paragraphs: ['Reason given: "x < y" & \'z\''],
    action: { label: 'Open the run', url: 'http://127.0.0.1:3000/runs/7?a=1&b=2' },
    table: [['case', 'verdict'], ['n=4 x=<0.5>', 'fail']],
    caution: true,
  })

  it('writes the same words into the text and the HTML part', () => {
    expect(m.text).toContain('Hello <script>alert(1)</script> & co,')
    expect(m.text).toContain('Open the run:\nhttp://127.0.0.1:3000/runs/7?a=1&b=2')
    expect(m.text).toMatch(/ {2}n=4 x=<0.5> {2}fail/)
    expect(m.text).toMatch(/does not replace your organisation's QA programme/)
    expect(m.html).toMatch(/does not replace your organisation&#39;s QA programme/)
  })

  it('escapes everything interpolated into the HTML part', () => {
    expect(m.html).not.toContain('<script>')
    expect(m.html).toContain('Hello &lt;script&gt;alert(1)&lt;/script&gt; &amp; co,')
    expect(m.html).toContain('&quot;x &lt; y&quot; &amp; &#39;z&#39;')
    expect(m.html).toContain('href="http://127.0.0.1:3000/runs/7?a=1&amp;b=2"')
    expect(m.html).toContain('<title>Subject &lt;b&gt;</title>')
    expect(m.html).toContain('n=4 x=&lt;0.5&gt;')
  })
})

describe('retry waits', () => {
  it.each([[1, 30_000], [2, 60_000], [3, 120_000], [8, 3_600_000], [20, 3_600_000]])('after attempt %i wait %i ms', (attempts, ms) => {
    expect(retryDelayMs(attempts, mailSettings({}))).toBe(ms)
  })

  it('takes the SMTP server and the waits from the environment', () => {
    const s = mailSettings({ PLUMBLINE_SMTP_HOST: 'smtp.example.test', PLUMBLINE_SMTP_PORT: '587', PLUMBLINE_MAIL_RETRY_BASE_MS: '100', PLUMBLINE_APP_URL: 'https://plumbline.example.test/' })
    expect(s).toMatchObject({ host: 'smtp.example.test', port: 587, retryBaseMs: 100, appUrl: 'https://plumbline.example.test' })
    expect(mailSettings({})).toMatchObject({ host: '127.0.0.1', port: 2525 })
  })
})
