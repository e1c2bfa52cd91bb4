import { codeSlugParamSchema, issueTokenSchema } from '../../../../shared/schemas/api-token'

// Issue a CI token for one code. The secret is in this reply only; the database keeps its SHA-256.
export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'qa', 'admin')
  const { slug } = validParams(event, codeSlugParamSchema)
  const input = await validBody(event, issueTokenSchema)
  const code = await findCode(slug)
  const { secret, prefix, hash } = newTokenSecret()
  const id = await useDb().transaction(async (tx) => {
    const [row] = await tx.insert(schema.apiTokens).values({
      codeId: code.id, name: input.name, scope: input.scope, tokenHash: hash, prefix,
      expiresAt: input.expiresAt ? new Date(input.expiresAt) : null, createdBy: user.id,
    }).$returningId()
    await recordAudit(tx, user, 'issue-token', 'api-token', row!.id, { code: code.slug, name: input.name, scope: input.scope, prefix, expiresAt: input.expiresAt ?? null })
    return row!.id
  })
  const [token] = await listTokens({ id })
  setResponseStatus(event, 201)
  return { token, secret, note: 'Copy the token now: Plumbline keeps only its hash and cannot show it again.' }
})
