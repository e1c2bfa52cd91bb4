/**
 * Canonical input keys: the exact identity of a case, used to remove
 * duplicate grid points and to match a solver's rows to cases.
 *
 * A number's canonical form depends only on its exact value, so "0.50",
 * "0.5", "+.5" and "5e-1" all give "0.5", and "-0" gives "0". Keys list the
 * parameters sorted by name: `n=12;x=0.5`.
 */
import { parseExactDecimal, type ExactDecimal } from '../numeric/exact'
import { parseDecimal } from '../compare/exact-ops'
import { CATALOGUE, isFunctionId } from '../reference/catalogue'

const PLAIN_LIMIT = 24
const CANONICAL_PLAIN = /^-?(?:0|[1-9]\d*)(?:\.\d*[1-9])?$/

/** The canonical text of an exact decimal: plain notation near 1, else `<integer>e<exp>`. */
export function canonicalDecimal(x: ExactDecimal): string {
  if (x.coef === 0n) return '0'
  const sign = x.neg ? '-' : ''
  const digits = x.coef.toString()
  if (x.exp >= 0 && x.exp <= PLAIN_LIMIT) return sign + digits + '0'.repeat(x.exp)
  if (x.exp < 0) {
    const frac = -x.exp
    if (frac < digits.length) return `${sign}${digits.slice(0, digits.length - frac)}.${digits.slice(digits.length - frac)}`
    if (frac - digits.length <= PLAIN_LIMIT) return `${sign}0.${'0'.repeat(frac - digits.length)}${digits}`
  }
  return `${sign}${digits}e${x.exp}`
}

/**
 * Whether text is already in canonical form as a plain decimal: no plus
 * sign, leading or trailing zeros, or "-0", and short enough that
 * canonicalDecimal keeps plain notation (PLAIN_LIMIT).
 */
export function isCanonicalPlain(text: string): boolean {
  return text.length <= PLAIN_LIMIT && CANONICAL_PLAIN.test(text) && text !== '-0'
}

/** Canonical text of a decimal string (throws DomainError when it is not a decimal). */
export function canonicalValue(text: string, param = 'value'): string {
  // already canonical: the common case when matching rows
  if (isCanonicalPlain(text)) return text
  const x = parseDecimal(text)
  if (x === null) return canonicalDecimal(parseExactDecimal(text, param)) // throws the engine's message
  return canonicalDecimal(x)
}

const NUMERIC_RE = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/

interface KeySpec { names: string[]; numeric: Set<string>; choice: Set<string>; defaults: Array<[string, string]> }
const SPECS = new Map<string, KeySpec>()

/** Sorted names, kinds and defaults of a function's parameters (cached). */
function specFor(functionId: string): KeySpec | null {
  if (!isFunctionId(functionId)) return null
  let spec = SPECS.get(functionId)
  if (!spec) {
    const ps = CATALOGUE[functionId].parameters
    spec = {
      names: ps.map(p => p.name).sort(),
      numeric: new Set(ps.filter(p => p.kind !== 'choice').map(p => p.name)),
      choice: new Set(ps.filter(p => p.kind === 'choice').map(p => p.name)),
      defaults: ps.filter(p => p.default !== undefined).map(p => [p.name, p.default!]),
    }
    SPECS.set(functionId, spec)
  }
  return spec
}

/**
 * The canonical key of a case's inputs. With a function id, parameters
 * left out take the catalogue default, choice parameters stay text and
 * numeric ones must be decimals (else DomainError); without one, every
 * decimal-looking value is canonicalised and other text is kept
 * (percent-encoded). Names are sorted. The server must call it the same way
 * for the set's cases and for the rows it matches (with the function id).
 */
export function inputKey(params: Record<string, string>, functionId?: string): string {
  const spec = functionId === undefined ? null : specFor(functionId)
  let names = Object.keys(params)
  if (spec) {
    const missing = spec.defaults.filter(([n]) => params[n] === undefined)
    if (missing.length > 0) { params = { ...params, ...Object.fromEntries(missing) }; names = Object.keys(params) }
  }
  names.sort()
  let key = ''
  for (const name of names) {
    const v = params[name]!
    const numeric = spec ? spec.numeric.has(name) || (!spec.choice.has(name) && NUMERIC_RE.test(v)) : NUMERIC_RE.test(v)
    // The function's numeric parameters must be decimals (canonicalValue throws otherwise).
    key += `${key ? ';' : ''}${name}=${numeric ? canonicalValue(v, name) : encodeURIComponent(v.trim())}`
  }
  return key
}
