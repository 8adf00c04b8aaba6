// `npm run migrate -- latest|rollback` against DATABASE_URL or the private MariaDB; with
// DATABASE_OWNER_URL the owner migrates and grants DATABASE_URL's account its tables.
import { resolveDatabase } from './database-url'
import { migrateAndGrant } from './grants'
import { createDb } from './knex'
import { rollbackAll } from './migrations'
import { seedStarterSpecifications } from '../services/specifications'

async function main(command = 'latest'): Promise<void> {
  if (command !== 'latest' && command !== 'rollback')
    throw new Error('usage: migrate latest|rollback')
  const given = {
    url: process.env.DATABASE_URL,
    ownerUrl: process.env.DATABASE_OWNER_URL,
    applicationHost: process.env.DATABASE_APP_HOST,
  }
  const database = await resolveDatabase(given, 'fractolog')
  const db = createDb(database.url)
  try {
    const names =
      command === 'latest'
        ? await migrateAndGrant(db, database.applicationAccount)
        : await rollbackAll(db)
    console.log(
      `${command}: ${names.length} migration(s)${names.length ? `: ${names.join(', ')}` : ''}`,
    )
    // An empty specification library starts with the engine's starter records, marked unverified.
    if (command === 'latest') await seedStarterSpecifications(db)
  } finally {
    await db.destroy()
    await database.local?.stop()
  }
}

main(process.argv[2]).catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error))
  process.exit(1)
})
