// Demo seed: `npm run seed`. Idempotent: rows are found by their natural keys
// and created only when missing; demo passwords are reset to the published ones.
// `npm run seed -- --large` adds the invented 50 × 30 × 10 load scenario
// (scripts/seed-large.ts) that the board benchmark reads.
import { and, eq } from 'drizzle-orm'
import { createDb, createPool, databaseUrl } from '../server/database/client'
import * as s from '../server/database/schema'
import { DEMO_CODES, DEMO_TEAMS, DEMO_TOKEN, DEMO_USERS } from '../server/database/seed/scenario'
import { hashUserPassword, sha256 } from '../server/database/seed/hash'
import { LOAD, seedLarge } from './seed-large'

const pool = createPool(databaseUrl())
const db = createDb(pool)

try {
  await db.transaction(async (tx) => {
    const userIds = new Map<string, number>()
    for (const u of DEMO_USERS) {
      const passwordHash = await hashUserPassword(u.password)
      const [found] = await tx.select({ id: s.users.id }).from(s.users).where(eq(s.users.email, u.email))
      if (found) {
        await tx.update(s.users).set({ name: u.name, role: u.role, passwordHash, disabled: false }).where(eq(s.users.id, found.id))
        userIds.set(u.email, found.id)
      }
      else {
        const [row] = await tx.insert(s.users).values({ email: u.email, name: u.name, role: u.role, passwordHash }).$returningId()
        userIds.set(u.email, row!.id)
      }
    }
    const teamIds = new Map<string, number>()
    for (const t of DEMO_TEAMS) {
      await tx.insert(s.teams).values(t).onDuplicateKeyUpdate({ set: { name: t.name } })
      const [row] = await tx.select({ id: s.teams.id }).from(s.teams).where(eq(s.teams.slug, t.slug))
      teamIds.set(t.slug, row!.id)
    }
    const codeIds = new Map<string, number>()
    for (const c of DEMO_CODES) {
      const values = { slug: c.slug, name: c.name, teamId: teamIds.get(c.team)!, description: c.description, language: c.language }
      await tx.insert(s.codes).values(values).onDuplicateKeyUpdate({ set: { name: c.name, description: c.description, language: c.language } })
      const [row] = await tx.select({ id: s.codes.id }).from(s.codes).where(eq(s.codes.slug, c.slug))
      const codeId = row!.id
      codeIds.set(c.slug, codeId)
      for (const email of c.owners) {
        await tx.insert(s.codeOwners).values({ codeId, userId: userIds.get(email)! }).onDuplicateKeyUpdate({ set: { codeId } })
      }
      for (const v of c.versions) {
        await tx.insert(s.versions).values({ codeId, ...v }).onDuplicateKeyUpdate({ set: { commitId: v.commitId } })
      }
    }
    const tokenHash = sha256(DEMO_TOKEN.token)
    const [tok] = await tx.select({ id: s.apiTokens.id }).from(s.apiTokens).where(and(eq(s.apiTokens.tokenHash, tokenHash)))
    if (!tok) {
      await tx.insert(s.apiTokens).values({
        codeId: codeIds.get(DEMO_TOKEN.code)!,
        name: DEMO_TOKEN.name,
        scope: DEMO_TOKEN.scope,
        tokenHash,
        prefix: DEMO_TOKEN.token.slice(0, 12),
        demoOnly: true,
        createdBy: userIds.get('admin@corrie-point.test')!,
      })
    }
    await tx.insert(s.auditLog).values({ actor: 'seed', action: 'seed-demo', objectType: 'registry', objectId: 'demo', detail: { users: DEMO_USERS.length, codes: DEMO_CODES.length } })
  })
  console.log(`demo data ready: ${DEMO_USERS.length} users, ${DEMO_TEAMS.length} teams, ${DEMO_CODES.length} codes`)
  if (process.argv.includes('--large')) {
    const [owner] = await db.select({ id: s.users.id }).from(s.users).where(eq(s.users.email, 'owner@corrie-point.test'))
    const large = await db.transaction(tx => seedLarge(tx as unknown as typeof db, owner?.id ?? null))
    console.log(large ? `load scenario ready: ${LOAD.codes} codes × ${LOAD.versions} versions × ${LOAD.sets} sets, ${large.runs} runs` : 'load scenario already present')
  }
}
finally {
  await pool.end()
}
