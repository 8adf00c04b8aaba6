import { readdirSync } from 'node:fs'
import { resolve } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import type { Knex } from 'knex'

const migrationsDir = resolve(fileURLToPath(import.meta.url), '../../../migrations')

/**
 * Loads the TypeScript migrations with this module's own `import()`, so they load wherever our
 * code runs (tsx, or vitest's module runner), not only where Node itself understands .ts.
 */
const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () =>
    readdirSync(migrationsDir)
      .filter((name) => /^\d{14}_[a-z0-9-]+\.ts$/.test(name))
      .sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) =>
    (await import(pathToFileURL(resolve(migrationsDir, name)).href)) as Knex.Migration,
}

export const migrationConfig: Knex.MigratorConfig = {
  migrationSource,
  tableName: 'knex_migrations',
}

export async function migrateLatest(db: Knex): Promise<string[]> {
  const [, applied] = (await db.migrate.latest(migrationConfig)) as [number, string[]]
  return applied
}

export async function rollbackAll(db: Knex): Promise<string[]> {
  const [, undone] = (await db.migrate.rollback(migrationConfig, true)) as [number, string[]]
  return undone
}

/** Names of the tables in the current database. */
export async function listTables(db: Knex): Promise<string[]> {
  const [rows] = (await db.raw('SHOW TABLES')) as [Record<string, string>[]]
  return rows.map((row) => Object.values(row)[0]).filter((name) => name !== undefined)
}

/** Drops every table in the current database: tests start from nothing. */
export async function dropAllTables(db: Knex): Promise<void> {
  const tables = await listTables(db)
  if (tables.length === 0) return
  // One connection for all three statements: the foreign-key switch is per connection.
  await db.transaction(async (trx) => {
    await trx.raw('SET FOREIGN_KEY_CHECKS = 0')
    await trx.raw(`DROP TABLE ${tables.map((name) => `\`${name}\``).join(', ')}`)
    await trx.raw('SET FOREIGN_KEY_CHECKS = 1')
  })
}
