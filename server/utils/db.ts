// The one database client of the server, over one pool.
import { createDb, createPool, type Db } from '../database/client'
import * as schema from '../database/schema'

let client: Db | undefined
let pool: ReturnType<typeof createPool> | undefined

export function useDb(): Db {
  if (!client) client = createDb(usePool())
  return client
}

/** The mysql2 pool under useDb(), for the few places that need a connection of their own (the run store's bulk load). */
export function usePool() {
  if (!pool) {
    const url = useRuntimeConfig().databaseUrl || process.env.NUXT_DATABASE_URL
    if (!url) throw createError({ statusCode: 500, message: 'The server has no database configured (NUXT_DATABASE_URL).' })
    pool = createPool(url)
  }
  return pool
}

export { schema }
