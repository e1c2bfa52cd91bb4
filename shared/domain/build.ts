// A version is one build. The first submission that names a commit or an
// environment field records it; later submissions for the same version may
// repeat it, leave it out, or add a field not yet recorded, but never change
// one, since the version's earlier runs were judged on that build. A
// different build needs a version label of its own.
import type { Environment } from '../schemas/submission'

export interface RecordedBuild { commitId: string, environment: Environment }
export interface GivenBuild { commit?: string, environment?: Environment }
export interface BuildConflict { field: string, recorded: string, given: string }

type Scalar = 'compiler' | 'flags' | 'platform' | 'floatFormat'
const SCALARS: Scalar[] = ['compiler', 'flags', 'platform', 'floatFormat']

/**
 * What a submission's build details do to a recorded version: the fields that
 * contradict it (`conflicts`, by field path as the submission names them), and
 * the version's build with the missing fields filled in (`filled`), or null
 * when nothing is added.
 */
export function reconcileBuild(recorded: RecordedBuild, given: GivenBuild): { conflicts: BuildConflict[], filled: RecordedBuild | null } {
  const conflicts: BuildConflict[] = []
  let changed = false
  let commitId = recorded.commitId
  if (given.commit) {
    if (!commitId) { commitId = given.commit; changed = true }
    else if (commitId !== given.commit) conflicts.push({ field: 'commit', recorded: commitId, given: given.commit })
  }
  const environment: Environment = { ...recorded.environment }
  const env = given.environment ?? {}
  for (const k of SCALARS) {
    const v = env[k]
    if (v === undefined || v === '') continue
    const was = environment[k]
    if (was === undefined || was === '') { (environment as Record<Scalar, string>)[k] = v; changed = true }
    else if (was !== v) conflicts.push({ field: `environment.${k}`, recorded: was, given: v })
  }
  if (env.libraries) {
    const libraries = { ...environment.libraries }
    for (const [name, v] of Object.entries(env.libraries)) {
      const was = libraries[name]
      if (was === undefined) { libraries[name] = v; changed = true }
      else if (was !== v) conflicts.push({ field: `environment.libraries.${name}`, recorded: was, given: v })
    }
    environment.libraries = libraries
  }
  return { conflicts, filled: changed && conflicts.length === 0 ? { commitId, environment } : null }
}

/** One sentence per conflict, for the 409 that refuses the submission. */
export function describeConflict(versionLabel: string, c: BuildConflict): string {
  const what = c.field === 'commit' ? 'commit' : c.field.replace(/^environment\./, '')
  return `Version ${versionLabel} was recorded with ${what} "${c.recorded}"; this submission says "${c.given}".`
}
