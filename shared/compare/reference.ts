/**
 * From an engine output to the judge's reference value.
 *
 * The engine's `exact` flag says the value was computed exactly; the string
 * is still rounded to `digits` (certify.ts roundExact), so it is not the
 * exact value in general. The judge's `exact` means "this string is the
 * exact value", which we can claim only for an exact zero.
 */
import type { OutputValue } from '../reference/index'
import type { ReferenceValue } from './judge'

/** The judge's view of one certified engine output. */
export function referenceFromOutput(o: Pick<OutputValue, 'value' | 'digits' | 'kappa' | 'exact'>): ReferenceValue {
  return { value: o.value, digits: o.digits, kappa: o.kappa, exact: o.exact && o.value === '0' }
}
