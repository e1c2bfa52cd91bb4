// Who may call a route: a signed-in user of one of its roles, OR a per-code CI
// token (Authorization: Bearer) of one of its scopes. A token only ever reaches
// its own code: routes call requireCodeAccess / requireRunAccess once they know
// which code the request is about, and filter lists with tokenCodeId.
import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import type { Role } from '../../shared/domain/enums'
import type { ApiToken } from '../database/schema'
import type { CurrentUser } from './auth'
import type { TokenScope } from './api-tokens'

export type Caller =
  | { kind: 'user', user: CurrentUser, token: null, actor: CurrentUser }
  | { kind: 'token', user: null, token: ApiToken, actor: { id: null, email: string } }

export interface AccessRule {
  /** Roles a signed-in user needs. */
  roles: readonly Role[]
  /** Token scopes the route accepts; leave out to refuse tokens. */
  scopes?: readonly TokenScope[]
}

/** Authenticate and authorise: 401 when anonymous or the token is dead, 403 for a wrong role or scope. */
export async function requireAccess(event: H3Event, rule: AccessRule): Promise<Caller> {
  if (bearerToken(event) !== null) {
    if (!rule.scopes?.length) throw httpError(403, 'token_not_accepted', 'CI tokens do not work on this route; sign in instead.')
    const token = await requireTokenOf(event, rule.scopes)
    return { kind: 'token', user: null, token, actor: { id: null, email: `token:${token.prefix}` } }
  }
  const user = await requireRole(event, ...rule.roles)
  return { kind: 'user', user, token: null, actor: user }
}

/** The one code a token caller may see, or null for a signed-in user (who sees every code). */
export const tokenCodeId = (caller: Caller): number | null => (caller.kind === 'token' ? caller.token.codeId : null)

/** 403 unless the caller may act on this code. */
export function requireCodeAccess(caller: Caller, codeId: number) {
  if (caller.kind === 'token' && caller.token.codeId !== codeId) throw httpError(403, 'token_wrong_code', 'This token belongs to another code.')
}

/**
 * 404 when the run does not exist; 403 when a token of another code asks.
 * Both scopes read their own code's runs: a pipeline reads back what it posted.
 */
export async function requireRunAccess(caller: Caller, runId: number) {
  const [run] = await useDb().select({ codeId: schema.versions.codeId })
    .from(schema.runs).innerJoin(schema.versions, eq(schema.versions.id, schema.runs.versionId)).where(eq(schema.runs.id, runId))
  if (!run) throw httpError(404, 'not_found', `There is no run with id ${runId}.`)
  requireCodeAccess(caller, run.codeId)
}
