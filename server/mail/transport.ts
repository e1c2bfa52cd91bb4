// Sending over SMTP with nodemailer; the server comes from the environment (config.ts).
import nodemailer from 'nodemailer'
import type { MailMessage } from '../database/schema'
import { mailSettings, type MailSettings } from './config'
import type { Send } from './outbox'

export function smtpSender(s: MailSettings = mailSettings()): Send {
  const transport = nodemailer.createTransport({
    host: s.host,
    port: s.port,
    secure: s.secure,
    auth: s.user ? { user: s.user, pass: s.pass ?? '' } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
    // the local catcher speaks plain SMTP on loopback; a real server offers STARTTLS and nodemailer takes it
    ignoreTLS: s.host === '127.0.0.1' || s.host === 'localhost',
  })
  return async (m: MailMessage) => {
    await transport.sendMail({
      from: s.from,
      to: m.toAddress,
      subject: m.subject,
      text: m.textBody,
      html: m.htmlBody,
      headers: { 'X-Plumbline-Kind': m.kind, 'X-Plumbline-Outbox-Id': String(m.id) },
    })
  }
}
