import type { Db } from '../database/client'
import { auditLog } from '../database/schema'
import type { CurrentUser } from './auth'

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
export type Writer = Db | Tx

/** Append one entry to the audit trail, inside the caller's transaction. */
export async function recordAudit(
  db: Writer,
  actor: CurrentUser | { id: null, email: string },
  action: string,
  objectType: string,
  objectId: string | number,
  detail: unknown = {},
) {
  await db.insert(auditLog).values({
    userId: actor.id,
    actor: actor.email,
    action,
    objectType,
    objectId: String(objectId),
    detail,
  })
}
