// CSV cells per RFC 4180, made safe against spreadsheet formula injection:
// a cell that starts with = + - @ (or a tab/CR) is prefixed with a quote
// mark unless it is a plain number (common practice, OWASP "CSV injection").
const NUMBER = /^[+-]?((\d+\.?\d*|\.\d+)([ed][+-]?\d+)?|inf(inity)?|nan)$/i

export function csvCell(value: string | number | null | undefined): string {
  let s = value === null || value === undefined ? '' : String(value)
  if (/^[=+\-@\t\r]/.test(s) && !NUMBER.test(s)) s = `'${s}`
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}
