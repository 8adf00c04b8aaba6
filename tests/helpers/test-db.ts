import { accountOfUrl, grantApplicationAccess } from '../../server/db/grants'
import { createDb, type Db } from '../../server/db/knex'
import { listTables } from '../../server/db/migrations'

export function testDatabaseUrl(
  name: 'TEST_DATABASE_URL' | 'E2E_DATABASE_URL' = 'TEST_DATABASE_URL',
): string {
  const url = process.env[name]
  if (!url) throw new Error(`${name} is not set: run the tests through \`npm test\``)
  return url
}

/** The owner's account of the API tests' database: factories, resets, direct checks. */
export function createTestDb(): Db {
  return createDb(testDatabaseUrl(), { min: 0, max: 4 })
}

type Which = 'TEST' | 'E2E'

/**
 * The application's account of a test database, as the running server has it (only the grants of
 * server/db/grants.ts); undefined when the run was given one account only.
 */
export function applicationDatabaseUrl(which: Which = 'TEST'): string | undefined {
  const url = process.env[`${which}_APP_DATABASE_URL`]
  return url && url !== process.env[`${which}_DATABASE_URL`] ? url : undefined
}

/** After migrating: the application's account gets its tables, as `npm start` gives them. */
export async function grantTestApplicationAccount(owner: Db, which: Which = 'TEST') {
  const url = applicationDatabaseUrl(which)
  if (!url) return
  await grantApplicationAccess(
    owner,
    accountOfUrl(url, process.env.TEST_APP_DATABASE_HOST ?? '127.0.0.1'),
  )
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
