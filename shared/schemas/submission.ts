import { z } from 'zod'

const label = z.string().trim().min(1, { error: 'Enter a version label.' }).max(100).regex(/^[\w.+\-~]+$/, { error: 'Use letters, digits and . + - _ ~ only.' })

export const environmentSchema = z.object({
  compiler: z.string().trim().max(120).optional(),
  flags: z.string().trim().max(400).optional(),
  platform: z.string().trim().max(120).optional(),
  floatFormat: z.string().trim().max(40).optional(),
  libraries: z.record(z.string().max(80), z.string().max(80)).optional(),
})

/** The fields that come with an uploaded table (multipart fields or a JSON body). */
export const submissionSchema = z.object({
  code: z.string().trim().regex(/^[a-z0-9-]{1,64}$/, { error: 'Name the code by its slug, e.g. oscillite.' }),
  version: label,
  setId: z.coerce.number().int().positive({ error: 'Choose a reference set.' }),
  mapping: z.record(z.string().max(40), z.string().max(200)).optional(),
  commit: z.string().trim().max(64).regex(/^[0-9a-zA-Z._-]*$/, { error: 'A commit id is letters and digits.' }).optional(),
  environment: environmentSchema.optional(),
})
export type SubmissionFields = z.infer<typeof submissionSchema>
