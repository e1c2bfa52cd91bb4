// Direct database access for API tests that must prove something about storage.
import { createConnection } from 'mysql2/promise'

export async function dbQuery<T = Record<string, unknown>>(sql: string, args: unknown[] = []): Promise<T[]> {
  const conn = await createConnection(process.env.NUXT_DATABASE_URL!)
  try {
    const [rows] = await conn.query(sql, args)
    return rows as T[]
  }
  finally {
    await conn.end()
  }
}
