/**
 * Canonical input keys: the exact identity of a case, used to remove
 * duplicate grid points and to match a solver's rows to cases.
 *
 * A number's canonical form depends only on its exact value, so "0.50",
 * "0.5", "+.5" and "5e-1" all give "0.5", and "-0" gives "0". Keys list the
 * parameters sorted by name: `n=12;x=0.5`.
 */
import { parseExactDecimal, type ExactDecimal } from '../numeric/exact'
import { CATALOGUE, isFunctionId } from '../reference/catalogue'

const PLAIN_LIMIT = 24

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

/** Canonical text of a decimal string (throws DomainError when it is not a decimal). */
export function canonicalValue(text: string, param = 'value'): string {
  return canonicalDecimal(parseExactDecimal(text, param))
}

const NUMERIC_RE = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/

/**
 * The canonical key of a case's inputs. With a function id, parameters
 * left out take the catalogue default, choice parameters stay text and
 * numeric ones must be decimals (else DomainError);
 * without one, every decimal-looking value is canonicalised and other text
 * is kept (percent-encoded). The server must call it the same way for the
 * set's cases and for the rows it matches (with the function id).
 */
export function inputKey(params: Record<string, string>, functionId?: string): string {
  const values: Record<string, string> = { ...params }
  const choice = new Set<string>()
  const numeric = new Set<string>()
  if (functionId !== undefined && isFunctionId(functionId)) {
    for (const spec of CATALOGUE[functionId].parameters) {
      if (values[spec.name] === undefined && spec.default !== undefined) values[spec.name] = spec.default
      if (spec.kind === 'choice') choice.add(spec.name)
      else numeric.add(spec.name)
    }
  }
  return Object.keys(values).sort().map((name) => {
    const v = values[name]!
    // The function's numeric parameters must be decimals (throws DomainError otherwise).
    const text = numeric.has(name) || (!choice.has(name) && NUMERIC_RE.test(v)) ? canonicalValue(v, name) : encodeURIComponent(v.trim())
    return `${name}=${text}`
  }).join(';')
}
