import { createDb } from '../../server/db/knex'
import { dropAllTables, migrateLatest, rollbackAll } from '../../server/db/migrations'
import { grantTestApplicationAccount, testDatabaseUrl } from './test-db'

/**
 * Once per API run: start from an empty database, and prove every migration's `down` by going
 * all the way up, all the way down and up again.
 */
export default async function setup(): Promise<void> {
  const db = createDb(testDatabaseUrl(), { min: 0, max: 2 })
  try {
    await dropAllTables(db)
    await migrateLatest(db)
    await rollbackAll(db)
    await migrateLatest(db)
    await grantTestApplicationAccount(db)
  } finally {
    await db.destroy()
  }
}
