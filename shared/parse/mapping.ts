/**
 * A first guess at which table column holds which input parameter of a
 * reference set, and which holds the computed value, for the submit
 * preview. The user confirms or changes it; nothing is judged on a guess.
 *
 * Order of preference: the same name (ignoring case and punctuation, so
 * `H_n(x)` reads as `hnx`), then a common synonym, then position (inputs
 * take the first free columns in order, the value the next free one).
 */

export type MatchedBy = 'name' | 'synonym' | 'position' | 'none'

export interface ColumnMapping {
  /** Parameter name (and `value`) → column name; undefined when nothing is left. */
  mapping: Record<string, string | undefined>
  how: Record<string, MatchedBy>
}

const norm = (s: string): string => s.toLowerCase().replace(/[^a-z0-9]+/g, '')

const PARAM_SYNONYMS: Record<string, string[]> = {
  n: ['order', 'degree', 'deg', 'index'],
  x: ['arg', 'argument', 'z', 't', 'point', 'abscissa'],
  z: ['arg', 'argument', 'x'],
  nu: ['v', 'order'],
}

/** Words codes use for the computed value (common practice). */
const VALUE_SYNONYMS = [
  'value', 'val', 'y', 'f', 'fx', 'result', 'res', 'output', 'out', 'computed', 'measured', 'approx',
  'h', 'hn', 'hnx', 'he', 'hen', 'henx', 'psi', 'psin', 'psinx', 'hermite', 'm', 'mabz', 'd', 'dnu', 'dnuz', 'u',
]

export function suggestColumnMapping(columns: string[], params: string[]): ColumnMapping {
  const keys = [...params, 'value']
  const mapping: Record<string, string | undefined> = {}
  const how: Record<string, MatchedBy> = {}
  const used = new Set<number>()
  const normed = columns.map(norm)
  const take = (key: string, j: number, by: MatchedBy): void => {
    mapping[key] = columns[j]
    how[key] = by
    used.add(j)
  }
  const free = (j: number): boolean => !used.has(j)
  const paramNames = new Set(params.map(norm))

  for (const key of keys) {
    const j = normed.findIndex((c, i) => free(i) && c === norm(key))
    if (j >= 0) take(key, j, 'name')
  }
  for (const key of params) {
    if (how[key]) continue
    const syn = (PARAM_SYNONYMS[norm(key)] ?? []).filter((s) => !paramNames.has(s))
    const j = normed.findIndex((c, i) => free(i) && syn.includes(c))
    if (j >= 0) take(key, j, 'synonym')
  }
  if (!how.value) {
    const syn = VALUE_SYNONYMS.filter((s) => !paramNames.has(s))
    for (const s of syn) {
      const j = normed.findIndex((c, i) => free(i) && c === s)
      if (j >= 0) { take('value', j, 'synonym'); break }
    }
  }
  for (const key of keys) {
    if (how[key]) continue
    const j = columns.findIndex((_, i) => free(i))
    if (j >= 0) take(key, j, 'position')
    else { mapping[key] = undefined; how[key] = 'none' }
  }
  return { mapping, how }
}
