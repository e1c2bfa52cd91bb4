// Every message in two parts, plain text and HTML, built from one description
// so the two always say the same thing. The HTML is a plain sheet of the
// product's paper and ink; everything interpolated is escaped.
export interface MailBody {
  /** First line of the message, a sentence. */
  greeting: string
  paragraphs: string[]
  action?: { label: string, url: string }
  /** A small table (e.g. the worst cases), first row the header. */
  table?: string[][]
  after?: string[]
  caution?: boolean
}

export const CAUTION = 'A verdict from Plumbline is evidence for a verification record. It does not replace your organisation\'s QA programme, local codes or licensed review.'
const FOOTER = 'This message was sent by Plumbline, the verification registry. You get it because of your role there; an administrator can change that.'

export function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;')
}

function textTable(rows: string[][]): string {
  const widths = rows[0]!.map((_, j) => Math.max(...rows.map(r => (r[j] ?? '').length)))
  return rows.map(r => '  ' + r.map((c, j) => c.padEnd(widths[j]!)).join('  ').trimEnd()).join('\n')
}

export function renderText(b: MailBody): string {
  const parts = [b.greeting, ...b.paragraphs]
  if (b.action) parts.push(`${b.action.label}:\n${b.action.url}`)
  if (b.table?.length) parts.push(textTable(b.table))
  parts.push(...(b.after ?? []))
  if (b.caution) parts.push(CAUTION)
  parts.push(`-- \n${FOOTER}`)
  return parts.join('\n\n') + '\n'
}

const INK = '#1f2633'
const SOFT = '#414b5c'
const RULE = '#c9bda3'

export function renderHtml(subject: string, b: MailBody): string {
  const p = (s: string, style = '') => `<p style="margin:0 0 14px;${style}">${esc(s)}</p>`
  const table = b.table?.length
    ? `<table style="border-collapse:collapse;margin:0 0 14px;font-family:'Source Code Pro',Menlo,monospace;font-size:13px">`
    + `<tr>${b.table[0]!.map(h => `<th style="text-align:left;padding:4px 10px 4px 0;border-bottom:1px solid ${INK};color:${SOFT}">${esc(h)}</th>`).join('')}</tr>`
    + b.table.slice(1).map(r => `<tr>${r.map(c => `<td style="padding:4px 10px 4px 0;border-bottom:1px solid ${RULE}">${esc(c)}</td>`).join('')}</tr>`).join('')
    + '</table>'
    : ''
  const action = b.action
    ? `<p style="margin:18px 0"><a href="${esc(b.action.url)}" style="display:inline-block;background:${INK};color:#f6f1e6;padding:9px 16px;text-decoration:none;font-weight:600">${esc(b.action.label)}</a></p>`
    + p(`Or copy this address: ${b.action.url}`, `font-size:13px;color:${SOFT};word-break:break-all`)
    : ''
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(subject)}</title></head>`
    + `<body style="margin:0;background:#f6f1e6;color:${INK};font-family:'Source Serif 4',Georgia,serif;font-size:16px;line-height:1.5">`
    + `<div style="max-width:600px;margin:0 auto;padding:24px 20px">`
    + `<p style="margin:0 0 18px;padding-bottom:8px;border-bottom:1px solid ${INK};font-weight:600;font-size:18px">Plumbline</p>`
    + p(b.greeting) + b.paragraphs.map(s => p(s)).join('') + action + table + (b.after ?? []).map(s => p(s)).join('')
    + (b.caution ? p(CAUTION, `border-left:2px solid #b8483b;padding:8px 12px;background:#ede5d3;font-size:14px`) : '')
    + `<p style="margin:24px 0 0;padding-top:8px;border-top:1px solid ${RULE};font-size:12px;color:${SOFT}">${esc(FOOTER)}</p>`
    + '</div></body></html>'
}

export function compose(kind: string, to: string, subject: string, body: MailBody) {
  return { kind, to, subject, text: renderText(body), html: renderHtml(subject, body) }
}
