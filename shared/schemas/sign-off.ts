// Sign-off of a version and the reference sets a code must have run first.
import { z } from 'zod'
import { codeSlug, setSlug, versionLabel } from './deviation'

export const codeParams = z.object({ slug: codeSlug })
export const versionParams = z.object({ slug: codeSlug, label: versionLabel })

export const requiredSetsSchema = z.object({
  sets: z.array(setSlug).max(50).refine(a => new Set(a).size === a.length, { error: 'A set is listed twice.' }),
})

export const signOffSchema = z.object({
  comment: z.string().trim().min(3, { error: 'Write a comment for the record (at least 3 characters).' }).max(4000),
})

export const recordExportQuery = z.object({
  format: z.enum(['json', 'csv', 'junit'], { error: 'Choose json, csv or junit.' }),
})
