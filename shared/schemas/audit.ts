import { z } from 'zod'

/** GET /api/audit: the trail, newest first, optionally for one object (type, or type and id). */
export const auditQuerySchema = z.object({
  objectType: z.string().trim().regex(/^[a-z0-9-]{1,40}$/, { error: 'An object type is lower-case letters, digits and dashes, e.g. run.' }).optional(),
  objectId: z.string().trim().min(1).max(64).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
}).refine(q => !q.objectId || q.objectType, { error: 'Name the object type too when filtering by object id.', path: ['objectType'] })
export type AuditQuery = z.infer<typeof auditQuerySchema>
