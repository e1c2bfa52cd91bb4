// Vocabulary shared by the schema, the server and the pages.

export const ROLES = ['admin', 'qa', 'owner', 'viewer'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  qa: 'Verification engineer',
  owner: 'Code owner',
  viewer: 'Reader (manager, auditor)',
}

/** Verdict of one case in a run. */
export const VERDICTS = ['pass', 'fail', 'missing', 'unexpected', 'non_finite', 'duplicate', 'accepted'] as const
export type Verdict = (typeof VERDICTS)[number]
