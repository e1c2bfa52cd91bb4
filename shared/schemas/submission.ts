import { z } from 'zod'

const label = z.string().trim().min(1, { error: 'Enter a version label.' }).max(100).regex(/^[\w.+\-~]+$/, { error: 'Use letters, digits and . + - _ ~ only.' })

/** Floating-point formats a build may compute in (IEEE 754 names where the standard has one). */
export const FLOAT_FORMATS = ['binary16', 'bfloat16', 'binary32', 'binary64', 'x87-extended', 'double-double', 'binary128', 'other'] as const

/** The build environment of a version, as sent with a submission. */
export const environmentSchema = z.strictObject({
  compiler: z.string().trim().max(120).optional(),
  flags: z.string().trim().max(400).optional(),
  platform: z.string().trim().max(120).optional(),
  floatFormat: z.enum(FLOAT_FORMATS, { error: `Name the floating-point format: ${FLOAT_FORMATS.join(', ')}.` }).optional(),
  libraries: z.record(
    z.string().trim().min(1).max(80).regex(/^[\w.+\-/@]+$/, { error: 'A library name is letters, digits and . + - _ / @.' }),
    z.string().trim().min(1).max(80),
  ).refine(r => Object.keys(r).length <= 40, { error: 'List at most 40 libraries.' }).optional(),
}, {
  error: iss => iss.code === 'unrecognized_keys'
    ? `Unknown field${iss.keys.length === 1 ? '' : 's'} ${iss.keys.map(k => `"${k}"`).join(', ')} in the build environment; use compiler, flags, platform, floatFormat and libraries.`
    : undefined,
})
export type Environment = z.infer<typeof environmentSchema>

/** A reference set's slug, naming its newest revision. */
export const setSlugSchema = z.string().trim().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: 'Name the reference set by its slug, e.g. hermite-core.' }).max(80)

/**
 * The fields that come with an uploaded table (multipart fields or a JSON
 * body). The set is given by id (one revision) or by slug (`set`: its newest
 * revision, so a pipeline follows revisions of the set), one of the two.
 */
export const submissionSchema = z.object({
  code: z.string().trim().regex(/^[a-z0-9-]{1,64}$/, { error: 'Name the code by its slug, e.g. oscillite.' }),
  version: label,
  setId: z.coerce.number().int().positive({ error: 'Choose a reference set.' }).optional(),
  set: setSlugSchema.optional(),
  mapping: z.record(z.string().max(40), z.string().max(200)).optional(),
  commit: z.string().trim().max(64).regex(/^[0-9a-zA-Z._-]*$/, { error: 'A commit id is letters and digits.' }).optional(),
  environment: environmentSchema.optional(),
}).superRefine((f, ctx) => {
  if (f.setId === undefined && f.set === undefined) ctx.addIssue({ code: 'custom', path: ['setId'], message: 'Choose a reference set: its id (setId), or its slug (set) for the newest revision.' })
  if (f.setId !== undefined && f.set !== undefined) ctx.addIssue({ code: 'custom', path: ['set'], message: 'Give the reference set once: by id (setId) or by slug (set), not both.' })
})
export type SubmissionFields = z.infer<typeof submissionSchema>
