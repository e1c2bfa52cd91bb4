// The rule for a version's build details (shared/domain/build.ts): recorded
// fields never change, missing ones are filled in. Our own rule, no outside source.
import { describe, expect, it } from 'vitest'
import { describeConflict, reconcileBuild, type GivenBuild, type RecordedBuild } from '../../../shared/domain/build'

const recorded: RecordedBuild = {
  commitId: 'a1b2c3',
  environment: { compiler: 'gfortran 13.2', floatFormat: 'binary64', libraries: { openblas: '0.3.26' } },
}

describe('a submission for an existing version', () => {
  it.each<[string, GivenBuild]>([
    ['nothing', {}],
    ['the same commit', { commit: 'a1b2c3' }],
    ['the same fields', { environment: { compiler: 'gfortran 13.2', libraries: { openblas: '0.3.26' } } }],
    ['the same commit and fields', { commit: 'a1b2c3', environment: { floatFormat: 'binary64' } }],
  ])('that repeats %s changes nothing', (_, given) => {
    expect(reconcileBuild(recorded, given)).toEqual({ conflicts: [], filled: null })
  })

  it.each<[string, GivenBuild, string, string, string]>([
    ['another commit', { commit: 'ffff00' }, 'commit', 'a1b2c3', 'ffff00'],
    ['another compiler', { environment: { compiler: 'gfortran 14.1' } }, 'environment.compiler', 'gfortran 13.2', 'gfortran 14.1'],
    ['another format', { environment: { floatFormat: 'binary32' } }, 'environment.floatFormat', 'binary64', 'binary32'],
    ['another library version', { environment: { libraries: { openblas: '0.3.27' } } }, 'environment.libraries.openblas', '0.3.26', '0.3.27'],
  ])('that gives %s is refused, naming the field', (_, given, field, was, now) => {
    const r = reconcileBuild(recorded, given)
    expect(r.conflicts).toEqual([{ field, recorded: was, given: now }])
    expect(r.filled).toBeNull()
  })

  it('names every contradicting field, and fills nothing when one contradicts', () => {
    const r = reconcileBuild(recorded, { commit: 'ffff00', environment: { compiler: 'clang 18', platform: 'aarch64-linux' } })
    expect(r.conflicts.map(c => c.field)).toEqual(['commit', 'environment.compiler'])
    expect(r.filled).toBeNull()
  })

  it('fills in what the version does not record yet, keeping what it does', () => {
    const r = reconcileBuild(recorded, { commit: 'a1b2c3', environment: { platform: 'x86_64-linux', flags: '-O2', libraries: { lapack: '3.12.0' } } })
    expect(r.conflicts).toEqual([])
    expect(r.filled).toEqual({
      commitId: 'a1b2c3',
      environment: { compiler: 'gfortran 13.2', floatFormat: 'binary64', platform: 'x86_64-linux', flags: '-O2', libraries: { openblas: '0.3.26', lapack: '3.12.0' } },
    })
  })

  it('records the commit of a version created without one', () => {
    expect(reconcileBuild({ commitId: '', environment: {} }, { commit: 'beef01' }).filled).toEqual({ commitId: 'beef01', environment: {} })
  })

  it('says which version, which field and both values', () => {
    expect(describeConflict('2.3.0', { field: 'environment.compiler', recorded: 'gfortran 13.2', given: 'clang 18' }))
      .toBe('Version 2.3.0 was recorded with compiler "gfortran 13.2"; this submission says "clang 18".')
  })
})
