/**
 * Parser timing: 100,000 rows × 3 columns in several writers' styles.
 * Prints rows/s for each and the ratio against a plain decode-and-split of
 * the same bytes, and the heap and RSS after. No assertions. Run with
 * `npx tsx bench/parse.ts [rows] [csv|fortran|hex|json ...]`; give one style
 * per run to read its peak RSS alone.
 */
import { performance } from 'node:perf_hooks'
import { parseTable } from '../shared/parse/index'

const ROWS = Number(process.argv[2] ?? 100_000)
const STYLES = ['csv', 'fortran', 'hex', 'json'] as const
type Style = typeof STYLES[number]
const chosen = process.argv.slice(3).filter((a): a is Style => (STYLES as readonly string[]).includes(a))

// Deterministic pseudo-random H-like values: wide exponents, 17 significant digits.
let seed = 42
const rnd = (): number => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648 }
const sig17 = (): string => (1 + rnd() * 8.999).toPrecision(17)

function rows(style: Style): string {
  const out: string[] = []
  if (style === 'csv') out.push('n,x,H')
  if (style === 'fortran') out.push('!   n        x                        H')
  for (let i = 0; i < ROWS; i++) {
    const n = i % 400
    const x = (rnd() * 40 - 20).toFixed(6)
    const e = Math.floor(rnd() * 600) - 300
    const m = sig17()
    if (style === 'csv') out.push(`${n},${x},${rnd() < 0.5 ? '-' : ''}${m}e${e}`)
    else if (style === 'fortran') {
      const digits = m.replace('.', '').slice(0, 16)
      const exp = Math.abs(e) > 99 ? `${e < 0 ? '-' : '+'}${Math.abs(e)}` : `D${e < 0 ? '-' : '+'}${String(Math.abs(e)).padStart(2, '0')}`
      out.push(`${String(n).padStart(4)} ${x.padStart(10)}    0.${digits}${exp}`)
    } else if (style === 'hex') out.push(`${n} ${x} 0x1.${Math.floor(rnd() * 2 ** 52).toString(16).padStart(13, '0')}p${e}`)
    else out.push(`{"n":${n},"x":${x},"H":${m}e${e}}`)
  }
  return style === 'json' ? `[${out.join(',\n')}]` : `${out.join('\n')}\n`
}

function time<T>(f: () => T): { ms: number; result: T } {
  const t0 = performance.now()
  const result = f()
  return { ms: performance.now() - t0, result }
}

for (const style of chosen.length > 0 ? chosen : STYLES) {
  const bytes = new TextEncoder().encode(rows(style))
  parseTable(bytes.subarray(0, 20_000)) // warm up
  const plain = time(() => new TextDecoder().decode(bytes).split('\n').map((l) => l.split(/[,\s]+/)).length)
  const heapBefore = process.memoryUsage().heapUsed
  const parsed = time(() => parseTable(bytes))
  const heapMb = (process.memoryUsage().heapUsed - heapBefore) / 1048576
  const t = parsed.result
  console.log([
    `${style.padEnd(8)} ${(bytes.length / 1048576).toFixed(1).padStart(5)} MB`,
    `${t.rows.length} rows, ${t.errorCount} errors`,
    `${parsed.ms.toFixed(0).padStart(5)} ms`,
    `${Math.round(t.rows.length / (parsed.ms / 1000)).toLocaleString('en-US').padStart(10)} rows/s`,
    `plain split ${plain.ms.toFixed(0)} ms (×${(parsed.ms / plain.ms).toFixed(1)})`,
    `heap +${heapMb.toFixed(0)} MB`,
    `rss ${(process.memoryUsage().rss / 1048576).toFixed(0)} MB`,
  ].join('  '))
}
