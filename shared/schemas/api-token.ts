import { z } from 'zod'

export const API_TOKEN_SCOPES = ['submit', 'read'] as const
export type ApiTokenScope = (typeof API_TOKEN_SCOPES)[number]

export const SCOPE_LABELS: Record<ApiTokenScope, string> = {
  submit: 'submit tables (and read back this code\'s runs)',
  read: 'read this code\'s board, versions and runs',
}

export const issueTokenSchema = z.object({
  name: z.string().trim().min(1, { error: 'Name the token after the pipeline that uses it.' }).max(120, { error: 'Use at most 120 characters.' }),
  scope: z.enum(API_TOKEN_SCOPES, { error: 'Choose submit or read.' }),
  /** Optional end of validity, an ISO date-time in the future. */
  expiresAt: z.iso.datetime({ offset: true, error: 'Give the expiry as a date and time, e.g. 2027-06-30T23:59:59Z.' })
    .refine(v => Date.parse(v) > Date.now(), { error: 'The expiry must lie in the future.' })
    .optional()
    .nullable(),
})
export type IssueTokenInput = z.infer<typeof issueTokenSchema>

export const codeSlugParamSchema = z.object({
  slug: z.string().regex(/^[a-z0-9-]{1,64}$/, { error: 'A code slug is lower-case letters, digits and dashes.' }),
})

/** A token as lists show it: never the secret. */
export interface ApiTokenListing {
  id: number
  name: string
  scope: ApiTokenScope
  prefix: string
  demoOnly: boolean
  state: 'active' | 'revoked' | 'expired'
  expiresAt: string | null
  revokedAt: string | null
  lastUsedAt: string | null
  createdBy: string | null
  createdAt: string
}
