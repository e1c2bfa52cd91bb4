// Display helpers for the exact decimal strings the run routes return.
// Everything works on the strings themselves: values such as H_400(40) or
// 1e-320 are far outside what a JS number shows faithfully.

export interface SciParts {
  sign: '' | '-'
  /** Significant digits, first one non-zero (or '0' for zero). */
  digits: string
  /** Power of ten of the first digit. */
  exponent: number
}

const DECIMAL = /^\s*([+-]?)(\d*)(?:\.(\d*))?(?:[eEdDqQ]([+-]?\d+))?\s*$/

/** Splits a decimal string into sign, significant digits and exponent; null for inf, nan and anything else. */
export function sciParts(text: string | null | undefined): SciParts | null {
  if (text == null) return null
  const m = DECIMAL.exec(text)
  if (!m || (!m[2] && !m[3])) return null
  const int = m[2] ?? ''
  const frac = m[3] ?? ''
  const all = int + frac
  const lead = all.search(/[1-9]/)
  const sign = m[1] === '-' ? '-' : ''
  if (lead < 0) return { sign, digits: '0', exponent: 0 }
  const digits = all.slice(lead).replace(/0+$/, '') || '0'
  const exponent = int.length - lead - 1 + Number(m[4] ?? 0)
  return { sign, digits, exponent }
}

/** Rounds significant digits half-up to at most p, carrying into the exponent. */
export function roundParts(p: SciParts, places: number): SciParts {
  if (p.digits.length <= places) return p
  const head = p.digits.slice(0, places).split('').map(Number)
  if (Number(p.digits[places]) >= 5) {
    let i = head.length - 1
    while (i >= 0) {
      head[i] = (head[i] ?? 0) + 1
      if (head[i]! < 10) break
      head[i] = 0
      i--
    }
    if (i < 0) return { sign: p.sign, digits: ('1' + head.join('')).slice(0, places).replace(/0+$/, '') || '1', exponent: p.exponent + 1 }
  }
  return { sign: p.sign, digits: head.join('').replace(/0+$/, '') || '0', exponent: p.exponent }
}

/** Significant digits and the exponent of the first one, written out without an exponent. */
function plainDecimal(digits: string, exponent: number): string {
  if (exponent < 0) return `0.${'0'.repeat(-exponent - 1)}${digits}`
  const int = digits.slice(0, exponent + 1).padEnd(exponent + 1, '0')
  const frac = digits.slice(exponent + 1)
  return frac ? `${int}.${frac}` : int
}

export interface ShortNumber { mantissa: string, exponent: number | null, text: string }

/**
 * A short form for tables: plain decimals from 1e-3 up to 1000, otherwise a
 * mantissa with its power of ten kept apart so the page can set it raised.
 */
export function shortNumber(text: string | null | undefined, places = 3): ShortNumber | null {
  if (text == null || text === '') return null
  const parts = sciParts(text)
  if (!parts) return { mantissa: text, exponent: null, text }
  const r = roundParts(parts, places)
  if (r.digits === '0') return { mantissa: '0', exponent: null, text: '0' }
  if (r.exponent >= -3 && r.exponent < 3) {
    const plain = r.sign + plainDecimal(r.digits, r.exponent)
    return { mantissa: plain, exponent: null, text: plain }
  }
  const mant = `${r.sign}${r.digits[0]}${r.digits.length > 1 ? '.' + r.digits.slice(1) : ''}`
  return { mantissa: mant, exponent: r.exponent, text: `${mant}e${r.exponent}` }
}

/** Case inputs as `n = 3, x = 0.5`. */
export function inputsText(inputs: Record<string, string> | null | undefined): string {
  if (!inputs) return '—'
  return Object.entries(inputs).map(([k, v]) => `${k} = ${v}`).join(', ')
}
