// Login throttling per account and per address, kept in MariaDB so that any
// number of stateless web servers share it. Only failures since the last
// success count, within a sliding window.
import { and, count, eq, gt, sql } from 'drizzle-orm'
import { loginAttempts } from '../database/schema'

export async function assertLoginAllowed(email: string, address: string) {
  const cfg = useRuntimeConfig().loginLimit
  const db = useDb()
  const since = sql`NOW(3) - INTERVAL ${Number(cfg.windowMinutes)} MINUTE`
  const lastSuccess = (col: typeof loginAttempts.email | typeof loginAttempts.address, value: string) =>
    sql`COALESCE((SELECT MAX(${loginAttempts.at}) FROM ${loginAttempts} WHERE ${col} = ${value} AND ${loginAttempts.succeeded} = 1), '1970-01-02')`
  const failures = async (col: typeof loginAttempts.email | typeof loginAttempts.address, value: string) => {
    const [row] = await db.select({ n: count() }).from(loginAttempts).where(and(
      eq(col, value),
      eq(loginAttempts.succeeded, false),
      gt(loginAttempts.at, since),
      gt(loginAttempts.at, lastSuccess(col, value)),
    ))
    return row?.n ?? 0
  }
  const [byAccount, byAddress] = await Promise.all([failures(loginAttempts.email, email), failures(loginAttempts.address, address)])
  if (byAccount >= Number(cfg.perAccount) || byAddress >= Number(cfg.perAddress)) {
    throw httpError(429, 'rate_limited', `Too many failed sign-in attempts. Wait ${cfg.windowMinutes} minutes or ask an administrator.`, { scope: byAccount >= Number(cfg.perAccount) ? 'account' : 'address' })
  }
}

export async function recordLoginAttempt(email: string, address: string, succeeded: boolean) {
  await useDb().insert(loginAttempts).values({ email, address, succeeded })
}
