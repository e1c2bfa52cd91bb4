import { sql } from 'drizzle-orm'

// Public liveness check for load balancers and the test harness.
export default defineEventHandler(async () => {
  await useDb().execute(sql`SELECT 1`)
  return { ok: true }
})
