// Mail settings, from the environment (read when used, so the web server, the
// worker and scripts share them). Defaults fit the local SMTP catcher that
// `npm start` and the tests run on loopback (scripts/mail-catcher.ts).
export interface MailSettings {
  host: string
  port: number
  secure: boolean
  user: string | undefined
  pass: string | undefined
  from: string
  /** Address the links in mails point to; never taken from a request's Host header. */
  appUrl: string
  retryBaseMs: number
  retryMaxMs: number
  maxAttempts: number
}

const int = (v: string | undefined, fallback: number) => (v && /^\d+$/.test(v) ? Number(v) : fallback)

export function mailSettings(env: NodeJS.ProcessEnv = process.env): MailSettings {
  return {
    host: env.PLUMBLINE_SMTP_HOST || '127.0.0.1',
    port: int(env.PLUMBLINE_SMTP_PORT, 2525),
    secure: env.PLUMBLINE_SMTP_SECURE === 'true',
    user: env.PLUMBLINE_SMTP_USER || undefined,
    pass: env.PLUMBLINE_SMTP_PASS || undefined,
    from: env.PLUMBLINE_MAIL_FROM || 'Plumbline <plumbline@localhost>',
    appUrl: (env.PLUMBLINE_APP_URL || 'http://127.0.0.1:3000').replace(/\/+$/, ''),
    retryBaseMs: int(env.PLUMBLINE_MAIL_RETRY_BASE_MS, 30_000),
    retryMaxMs: int(env.PLUMBLINE_MAIL_RETRY_MAX_MS, 60 * 60_000),
    maxAttempts: int(env.PLUMBLINE_MAIL_MAX_ATTEMPTS, 10),
  }
}

/** Wait before attempt `attempts + 1`: doubling from the base, capped. */
export function retryDelayMs(attempts: number, s: Pick<MailSettings, 'retryBaseMs' | 'retryMaxMs'>): number {
  return Math.min(s.retryMaxMs, s.retryBaseMs * 2 ** Math.max(0, attempts - 1))
}
