import { createDb, type Db } from '../../server/db/knex'
import { listTables } from '../../server/db/migrations'

export function testDatabaseUrl(
  name: 'TEST_DATABASE_URL' | 'E2E_DATABASE_URL' = 'TEST_DATABASE_URL',
): string {
  const url = process.env[name]
  if (!url) throw new Error(`${name} is not set: run the tests through \`npm test\``)
  return url
}

export function createTestDb(): Db {
  return createDb(testDatabaseUrl(), { min: 0, max: 4 })
}

/** Empties every table but the migration bookkeeping, so each test file starts from nothing. */
export async function resetDatabase(db: Db): Promise<void> {
  const tables = (await listTables(db)).filter((name) => !name.startsWith('knex_migrations'))
  await db.transaction(async (trx) => {
    await trx.raw('SET FOREIGN_KEY_CHECKS = 0')
    for (const table of tables) await trx.raw(`TRUNCATE TABLE \`${table}\``)
    await trx.raw('SET FOREIGN_KEY_CHECKS = 1')
  })
}
