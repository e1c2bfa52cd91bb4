/** Case grids: expansion, canonical keys and the seeded generator. */
export { expandGrid, expandReferenceSet, type GridCase, type SetCase, type ExpandOptions } from './expand'
export { inputKey, canonicalDecimal, canonicalValue } from './keys'
export { GridError, type GridIssue, rangeCount, toFixedPlaces } from './parts'
export { Xoshiro128ss, splitMix64 } from './prng'
