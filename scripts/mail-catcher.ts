// The local SMTP catcher for development and tests: an SMTP server on loopback
// (the smtp-server package) that accepts every message and keeps it as an .eml
// file, and a small HTTP side on loopback that lists what it caught, parsed
// with mailparser, for the Outbox page. Nothing is relayed anywhere.
//
//   PLUMBLINE_SMTP_PORT      SMTP port (default 2525)
//   PLUMBLINE_CATCHER_PORT   HTTP port (default 2527)
//   PLUMBLINE_CATCHER_DIR    where messages are kept (default .data/mail-catcher)
//
// HTTP: GET /messages (newest first), GET /health, and POST /smtp/stop and
// /smtp/start, which close and reopen the SMTP port (the tests use them to
// show that mail waits in the outbox while the server is away).
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { createServer } from 'node:http'
import { join, resolve } from 'node:path'
import { simpleParser } from 'mailparser'
import { SMTPServer } from 'smtp-server'

const HOST = '127.0.0.1'
const smtpPort = Number(process.env.PLUMBLINE_SMTP_PORT || 2525)
const httpPort = Number(process.env.PLUMBLINE_CATCHER_PORT || 2527)
const dir = resolve(process.env.PLUMBLINE_CATCHER_DIR || join(import.meta.dirname, '../.data/mail-catcher'))
mkdirSync(dir, { recursive: true })

let seq = 0
let smtp: SMTPServer | null = null

function startSmtp(): Promise<void> {
  if (smtp) return Promise.resolve()
  const server = new SMTPServer({
    name: 'plumbline-catcher',
    banner: 'Plumbline local mail catcher; nothing is relayed',
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: 10 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (c: Buffer) => chunks.push(c))
      stream.on('end', () => {
        const name = `${Date.now()}-${process.pid}-${String(seq++).padStart(6, '0')}.eml`
        const envelope = `X-Catcher-Envelope-To: ${session.envelope.rcptTo.map(r => r.address).join(', ')}\r\n`
        writeFileSync(join(dir, name), Buffer.concat([Buffer.from(envelope), ...chunks]))
        callback()
      })
    },
  })
  smtp = server
  return new Promise((done, fail) => {
    server.once('error', fail)
    server.listen(smtpPort, HOST, () => done())
  })
}

function stopSmtp(): Promise<void> {
  const server = smtp
  smtp = null
  return new Promise(done => (server ? server.close(() => done()) : done()))
}

const parsed = new Map<string, unknown>()

async function messages() {
  const files = readdirSync(dir).filter(f => f.endsWith('.eml')).sort().reverse()
  const out = []
  for (const f of files) {
    if (!parsed.has(f)) {
      const m = await simpleParser(readFileSync(join(dir, f)))
      const header = (k: string) => m.headers.get(k)
      parsed.set(f, {
        id: f.replace(/\.eml$/, ''),
        receivedAt: new Date(Number(f.split('-')[0])).toISOString(),
        from: m.from?.text ?? '',
        to: String(header('x-catcher-envelope-to') ?? ''),
        subject: m.subject ?? '',
        kind: String(header('x-plumbline-kind') ?? ''),
        outboxId: header('x-plumbline-outbox-id') ? Number(header('x-plumbline-outbox-id')) : null,
        text: m.text ?? '',
        html: typeof m.html === 'string' ? m.html : '',
      })
    }
    out.push(parsed.get(f))
  }
  return out
}

const http = createServer((req, res) => {
  const reply = (status: number, body: unknown) => {
    res.writeHead(status, { 'content-type': 'application/json; charset=utf-8' })
    res.end(JSON.stringify(body))
  }
  const route = `${req.method} ${req.url?.split('?')[0]}`
  const handle = async () => {
    if (route === 'GET /health') return reply(200, { ok: true, smtp: smtp !== null, smtpPort })
    if (route === 'GET /messages') return reply(200, { messages: await messages() })
    if (route === 'POST /smtp/stop') {
      await stopSmtp()
      return reply(200, { smtp: false })
    }
    if (route === 'POST /smtp/start') {
      await startSmtp()
      return reply(200, { smtp: true })
    }
    reply(404, { message: `No such catcher route: ${route}` })
  }
  handle().catch(e => reply(500, { message: e instanceof Error ? e.message : String(e) }))
})

await startSmtp()
http.listen(httpPort, HOST, () => {
  console.log(`mail catcher: SMTP on ${HOST}:${smtpPort}, messages on http://${HOST}:${httpPort}/messages, kept in ${dir}`)
})
const quit = () => {
  http.close()
  void stopSmtp().then(() => process.exit(0))
}
process.on('SIGTERM', quit)
process.on('SIGINT', quit)
