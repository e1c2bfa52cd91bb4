import { describe, expect, it } from 'vitest'
import { isWorse } from '../../../shared/domain/regression'

describe('regression rule', () => {
  it.each([
    [{ newlyFailing: 0, failuresBefore: 0, failuresAfter: 0 }, false],
    [{ newlyFailing: 1, failuresBefore: 1, failuresAfter: 1 }, true], // one fixed, another broken
    [{ newlyFailing: 0, failuresBefore: 2, failuresAfter: 3 }, true], // more failures, none matched
    [{ newlyFailing: 0, failuresBefore: 3, failuresAfter: 1 }, false], // fixed some
  ])('%j is worse: %s', (e, worse) => {
    expect(isWorse({ previousRunId: 1, ...e })).toBe(worse)
  })
})
