// The one database client of the server, over one pool.
import { createDb, createPool, type Db } from '../database/client'
import * as schema from '../database/schema'

let client: Db | undefined

export function useDb(): Db {
  if (!client) {
    const url = useRuntimeConfig().databaseUrl || process.env.NUXT_DATABASE_URL
    if (!url) throw createError({ statusCode: 500, message: 'The server has no database configured (NUXT_DATABASE_URL).' })
    client = createDb(createPool(url))
  }
  return client
}

export { schema }
