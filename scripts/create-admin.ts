// `npm run create-admin -- --email X --name Y`: the first administrator of a real installation.
// Migrates first (as `npm start` does), then prints a one-time password to change at first sign-in.
import { parseArgs } from 'node:util'
import { ConfigError, loadConfig } from '../server/config'
import { resolveDatabase } from '../server/db/database-url'
import { migrateAndGrant } from '../server/db/grants'
import { createDb } from '../server/db/knex'
import { createAdministrator } from '../server/services/first-administrator'

const USAGE = 'usage: npm run create-admin -- --email person@example.org --name "Their Name"'

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: { email: { type: 'string' }, name: { type: 'string' } },
    strict: true,
  })
  if (!values.email || !values.name) throw new ConfigError(USAGE)
  const config = loadConfig()
  const given = {
    url: config.databaseUrl,
    ownerUrl: config.databaseOwnerUrl,
    applicationHost: config.databaseAppHost,
  }
  const database = await resolveDatabase(given, 'fractolog')
  const db = createDb(database.url, { min: 0, max: 2 })
  try {
    await migrateAndGrant(db, database.applicationAccount)
    const { oneTimePassword } = await createAdministrator(
      db,
      { email: values.email, name: values.name },
      { passwordCost: config.passwordCost, hours: config.oneTimePasswordHours },
    )
    console.log(`Administrator ${values.email.trim().toLowerCase()} created.`)
    console.log(
      `One-time password (valid ${config.oneTimePasswordHours} hours): ${oneTimePassword}`,
    )
    console.log('It must be changed at first sign-in, and a second factor set up.')
  } finally {
    await db.destroy()
    await database.local?.stop()
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error))
  process.exit(1)
})
