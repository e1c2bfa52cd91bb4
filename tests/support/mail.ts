// The local SMTP catcher that scripts/test.sh starts: what it received, and
// its switch to close and reopen the SMTP port.
import { expect } from 'vitest'
import { dbQuery } from './db'

export const CATCHER = process.env.PLUMBLINE_CATCHER_URL ?? 'http://127.0.0.1:2528'

export interface CaughtMessage {
  id: string
  receivedAt: string
  from: string
  to: string
  subject: string
  kind: string
  outboxId: number | null
  text: string
  html: string
}

export async function caughtMessages(): Promise<CaughtMessage[]> {
  const res = await fetch(`${CATCHER}/messages`)
  return ((await res.json()) as { messages: CaughtMessage[] }).messages
}

/** Wait until the catcher has received messages matching `match` (the worker sends within a second or two). */
export async function waitForMail(match: (m: CaughtMessage) => boolean, count = 1, tries = 150): Promise<CaughtMessage[]> {
  for (let i = 0; i < tries; i++) {
    const found = (await caughtMessages()).filter(match)
    if (found.length >= count) return found
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error(`the catcher did not receive ${count} matching message(s)`)
}

export async function smtp(action: 'stop' | 'start') {
  const res = await fetch(`${CATCHER}/smtp/${action}`, { method: 'POST' })
  expect(res.status).toBe(200)
}

/** The secret of the set-password link in a message's text part. */
export function linkSecret(text: string): { url: string, secret: string } {
  const m = /(https?:\/\/\S+\/set-password#token=([\w-]+))/.exec(text)
  if (!m) throw new Error(`no set-password link in:\n${text}`)
  return { url: m[1]!, secret: m[2]! }
}

/**
 * Put a message in the outbox as one the worker gave up on (state failed),
 * as after a long SMTP outage, and return its id.
 */
export async function plantGivenUpMail(to: string, subject: string): Promise<number> {
  await dbQuery(
    `INSERT INTO mail_outbox (kind, to_address, subject, text_body, html_body, state, attempts, last_error, next_attempt_at)
     VALUES ('run-failure', ?, ?, 'A test message that could not be delivered.', '<!doctype html><p>A test message that could not be delivered.</p>', 'failed', 8, 'gave up after 8 attempts: connect ECONNREFUSED 127.0.0.1:2526', NOW(3))`,
    [to, subject])
  const [row] = await dbQuery<{ id: number }>('SELECT id FROM mail_outbox WHERE subject = ?', [subject])
  return row!.id
}
