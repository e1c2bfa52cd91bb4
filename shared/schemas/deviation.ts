// Deviations: proposing one on a code's reference set, and settling it.
import { z } from 'zod'
import { DEVIATION_SCOPES, DEVIATION_STATES } from '../domain/deviations'

export const codeSlug = z.string().trim().regex(/^[a-z0-9-]{1,64}$/, { error: 'Name the code by its slug, e.g. oscillite.' })
export const setSlug = z.string().trim().min(2).max(80).regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: 'Name the reference set by its slug.' })
export const versionLabel = z.string().trim().min(1, { error: 'Enter a version label.' }).max(100).regex(/^[\w.+\-~]+$/, { error: 'Use letters, digits and . + - _ ~ only.' })

export const proposeDeviationSchema = z.object({
  code: codeSlug,
  set: setSlug,
  scope: z.enum(DEVIATION_SCOPES, { error: 'Choose case, region or set.' }),
  /** The case's inputs, for scope `case`; matched by exact value, whatever the spelling. */
  inputs: z.record(z.string().max(40), z.string().trim().min(1).max(200)).optional(),
  region: z.string().trim().min(1).max(60).optional(),
  reason: z.string().trim().min(10, { error: 'Say why the failure is acceptable, in at least 10 characters.' }).max(4000),
  expiresAtVersion: versionLabel.optional(),
  expiresOn: z.iso.date({ error: 'Give the expiry date as YYYY-MM-DD.' }).optional(),
}).superRefine((v, ctx) => {
  if (v.scope === 'case' && (!v.inputs || Object.keys(v.inputs).length === 0)) ctx.addIssue({ code: 'custom', path: ['inputs'], message: 'A case deviation names the case by its inputs.' })
  if (v.scope === 'region' && !v.region) ctx.addIssue({ code: 'custom', path: ['region'], message: 'A region deviation names the region.' })
  if (!v.expiresAtVersion === !v.expiresOn) ctx.addIssue({ code: 'custom', path: ['expiresAtVersion'], message: 'Give one expiry: a version label or a date.' })
})
export type ProposeDeviationInput = z.infer<typeof proposeDeviationSchema>

export const decideDeviationSchema = z.object({
  comment: z.string().trim().min(3, { error: 'Write a comment for the record (at least 3 characters).' }).max(4000),
})

export const withdrawDeviationSchema = z.object({
  comment: z.string().trim().max(4000).default(''),
})

export const deviationListQuery = z.object({
  code: codeSlug.optional(),
  set: setSlug.optional(),
  state: z.enum(DEVIATION_STATES).optional(),
})
