import { z } from 'zod'

const label = z.string().trim().min(1, { error: 'Name a version label.' }).max(100)

export const COMPARE_KINDS = ['all', 'newly-failing', 'fixed', 'still-failing', 'worse', 'better'] as const
export const COMPARE_SORTS = ['change', 'from', 'to', 'case'] as const

/** GET /api/codes/[slug]/compare: two versions of one code on one reference-set slug. */
export const compareQuerySchema = z.object({
  from: label,
  to: label,
  set: z.string().trim().regex(/^[a-z0-9-]{1,80}$/, { error: 'Name the reference set by its slug.' }),
  kind: z.enum(COMPARE_KINDS, { error: `Choose one of ${COMPARE_KINDS.join(', ')}.` }).default('all'),
  sort: z.enum(COMPARE_SORTS, { error: `Sort by ${COMPARE_SORTS.join(', ')}.` }).default('change'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
})
export type CompareQuery = z.infer<typeof compareQuerySchema>
