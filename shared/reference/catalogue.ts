/**
 * The function catalogue: our ids, the DLMF notation, the convention, the
 * parameters with their domains, and the identities each entry satisfies.
 * Plain data, for the engine's validation and for later UI use.
 * DLMF equation numbers are cited from memory; check before printing them.
 */

export type FunctionId =
  | 'hermite' | 'hermite-prob' | 'hermite-function' | 'hermite-derivative'
  | 'gauss-hermite' | 'hermite-series' | 'kummer' | 'parabolic-cylinder'

export interface ParameterSpec {
  name: string
  kind: 'integer' | 'real' | 'choice'
  description: string
  min?: number
  max?: number
  choices?: readonly string[]
  /** Default for optional parameters. */
  default?: string
}

export interface CatalogueEntry {
  id: FunctionId
  title: string
  notation: string
  convention: string
  reference: string
  parameters: ParameterSpec[]
  outputs: string[]
  identities: string[]
  /** Whether κ = |x f'/f| is reported. */
  condition: boolean
}

const X = { name: 'x', kind: 'real', description: 'argument, |x| ≤ 1e6', min: -1e6, max: 1e6 } as const
const N = (max: number) => ({ name: 'n', kind: 'integer', description: 'degree', min: 0, max }) as const

export const CATALOGUE: Record<FunctionId, CatalogueEntry> = {
  'hermite': {
    id: 'hermite', title: 'Hermite polynomial, physicists’', notation: 'H_n(x)',
    convention: 'orthogonal for the weight e^{−x²} on ℝ; leading coefficient 2^n', reference: 'DLMF 18.3',
    parameters: [N(20000), X], outputs: ['value'], condition: true,
    identities: ['H_{n+1}(x) = 2x H_n(x) − 2n H_{n−1}(x) (DLMF 18.9.1)', 'H_n(−x) = (−1)^n H_n(x) (DLMF 18.6.1)',
      'H_n′(x) = 2n H_{n−1}(x) (DLMF 18.9.25)', 'e^{2xt−t²} = Σ H_n(x) t^n/n! (DLMF 18.12.15)'],
  },
  'hermite-prob': {
    id: 'hermite-prob', title: 'Hermite polynomial, probabilists’', notation: 'He_n(x)',
    convention: 'orthogonal for the weight e^{−x²/2} on ℝ; monic', reference: 'DLMF 18.3',
    parameters: [N(20000), X], outputs: ['value'], condition: true,
    identities: ['He_{n+1}(x) = x He_n(x) − n He_{n−1}(x) (DLMF 18.9.1)', 'He_n(x) = 2^{−n/2} H_n(x/√2) (DLMF 18.7.11)'],
  },
  'hermite-function': {
    id: 'hermite-function', title: 'Hermite function (oscillator eigenfunction)', notation: 'ψ_n(x)',
    convention: 'ψ_n(x) = (2^n n! √π)^{−1/2} e^{−x²/2} H_n(x); orthonormal on ℝ', reference: 'DLMF 18.3 (h_n = 2^n n! √π)',
    parameters: [N(20000), X], outputs: ['value'], condition: true,
    identities: ['∫ ψ_m ψ_n dx = δ_{mn}', 'ψ_n′(x) = √(2n) ψ_{n−1}(x) − x ψ_n(x)'],
  },
  'hermite-derivative': {
    id: 'hermite-derivative', title: 'Derivative of the Hermite polynomial', notation: 'd^k/dx^k H_n(x)',
    convention: 'physicists’ H_n', reference: 'DLMF 18.9.25',
    parameters: [N(20000), { name: 'k', kind: 'integer', description: 'order of the derivative', min: 0, max: 20000 }, X],
    outputs: ['value'], condition: true,
    identities: ['d^k/dx^k H_n(x) = 2^k n!/(n−k)! H_{n−k}(x), zero for k > n'],
  },
  'gauss-hermite': {
    id: 'gauss-hermite', title: 'Gauss–Hermite quadrature rule', notation: 'x_i, w_i',
    convention: 'physicists’ weight e^{−x²} or probabilists’ e^{−x²/2}; nodes ascending, i = 1…n',
    reference: 'DLMF 3.5(v); A&S 25.4.46',
    parameters: [
      { name: 'n', kind: 'integer', description: 'number of points', min: 1, max: 1000 },
      { name: 'weight', kind: 'choice', description: 'weight function', choices: ['physicists', 'probabilists'], default: 'physicists' },
      { name: 'i', kind: 'integer', description: 'node index, 1…n ascending', min: 1, max: 1000 },
    ],
    outputs: ['node', 'weight'], condition: false,
    identities: ['Σ w_i = √π (physicists) or √(2π) (probabilists)', 'exact for polynomials of degree ≤ 2n − 1', 'x_{n+1−i} = −x_i'],
  },
  'hermite-series': {
    id: 'hermite-series', title: 'Power-series solutions of the Hermite equation', notation: 'y_even(x), y_odd(x)',
    convention: 'y″ − 2x y′ + 2λ y = 0; y_even(0) = 1, y_even′(0) = 0; y_odd(0) = 0, y_odd′(0) = 1',
    reference: 'DLMF 13.2.2 (1F1 forms)',
    parameters: [{ name: 'lambda', kind: 'real', description: 'the eigenvalue parameter λ', min: -1e4, max: 1e4 },
      { name: 'x', kind: 'real', description: 'argument, x² ≤ 5000', min: -70, max: 70 }],
    outputs: ['y_even', 'y_odd'], condition: true,
    identities: ['y_even = 1F1(−λ/2; 1/2; x²)', 'y_odd = x·1F1((1−λ)/2; 3/2; x²)', 'a_{k+2} = 2(k − λ) a_k/((k+1)(k+2))'],
  },
  'kummer': {
    id: 'kummer', title: 'Kummer’s confluent hypergeometric function', notation: 'M(a, b, z)',
    convention: '1F1(a; b; z) = Σ (a)_k z^k/((b)_k k!); not regularised', reference: 'DLMF 13.2.2',
    parameters: [{ name: 'a', kind: 'real', description: 'numerator parameter', min: -1e4, max: 1e4 },
      { name: 'b', kind: 'real', description: 'denominator parameter, not 0, −1, −2, …', min: -1e4, max: 1e4 },
      { name: 'z', kind: 'real', description: 'argument, |z| ≤ 5000', min: -5000, max: 5000 }],
    outputs: ['value'], condition: true,
    identities: ['M(a, b, z) = e^z M(b − a, b, −z) (DLMF 13.2.39)', 'M(a, a, z) = e^z'],
  },
  'parabolic-cylinder': {
    id: 'parabolic-cylinder', title: 'Parabolic cylinder function', notation: 'D_ν(z)',
    convention: 'Whittaker’s D_ν(z) = U(−ν − ½, z)', reference: 'DLMF 12.1, 12.2, 12.4, 12.7',
    parameters: [{ name: 'nu', kind: 'real', description: 'order ν, |ν| ≤ 200', min: -200, max: 200 },
      { name: 'z', kind: 'real', description: 'argument; |z| ≤ 40 unless ν is a non-negative integer', min: -1e6, max: 1e6 }],
    outputs: ['value'], condition: true,
    identities: ['D_n(z) = e^{−z²/4} He_n(z) (DLMF 12.7.2)', 'D_ν′(z) = ½z D_ν(z) − D_{ν+1}(z) (DLMF 12.8.2)'],
  },
}

export const FUNCTION_IDS = Object.keys(CATALOGUE) as FunctionId[]

export function isFunctionId(id: string): id is FunctionId {
  return Object.prototype.hasOwnProperty.call(CATALOGUE, id)
}
