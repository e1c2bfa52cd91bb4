// Apply drizzle/ migrations to the database named by NUXT_DATABASE_URL.
import { migrate } from 'drizzle-orm/mysql2/migrator'
import { createDb, createPool, databaseUrl } from '../server/database/client'

const pool = createPool(databaseUrl())
try {
  await migrate(createDb(pool), { migrationsFolder: new URL('../drizzle', import.meta.url).pathname })
  console.log('migrations applied')
}
finally {
  await pool.end()
}
