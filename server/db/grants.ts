import type { Knex } from 'knex'
import { listTables, migrateLatest } from './migrations'

/** Tables whose rows the running application may add and read, never change or remove. */
export const APPEND_ONLY_TABLES = ['audit_events', 'security_events'] as const

export interface DatabaseAccountName {
  user: string
  host: string
}

const PLAIN = /^[\w.%:-]+$/

function accountSql({ user, host }: DatabaseAccountName): string {
  if (!PLAIN.test(user) || !PLAIN.test(host)) {
    throw new Error(`Database account names must be plain words: ${user}@${host}`)
  }
  return `'${user}'@'${host}'`
}

/**
 * Gives the application's own database account exactly what it needs, table by table, after
 * the migrations (run by the owner) have made the tables. Every table the migrations know gets
 * SELECT, INSERT, UPDATE and DELETE, except the append-only trails, which get SELECT and INSERT
 * only; a new migration's tables are covered the next time this runs, with nothing to add.
 */
export async function grantApplicationAccess(
  owner: Knex,
  account: DatabaseAccountName,
): Promise<number> {
  const who = accountSql(account)
  const [[{ name }]] = (await owner.raw('SELECT DATABASE() AS name')) as [[{ name: string }]]
  const tables = (await listTables(owner)).filter((table) => !table.startsWith('knex_migrations'))
  const appendOnly = new Set<string>(APPEND_ONLY_TABLES)
  for (const table of tables) {
    const target = `\`${name}\`.\`${table}\``
    if (appendOnly.has(table)) {
      await owner.raw(`GRANT SELECT, INSERT ON ${target} TO ${who}`)
      // an earlier, wider grant (by hand, or an older version) must not survive
      await owner.raw(`REVOKE UPDATE, DELETE, DROP, ALTER ON ${target} FROM ${who}`)
    } else {
      await owner.raw(`GRANT SELECT, INSERT, UPDATE, DELETE ON ${target} TO ${who}`)
    }
  }
  return tables.length
}

/** The account named by a mysql:// URL, at the host it connects from. */
export function accountOfUrl(url: string, host: string): DatabaseAccountName {
  return { user: decodeURIComponent(new URL(url).username), host }
}

/** Migrates with the owner's account, then grants the application's account its tables. */
export async function migrateAndGrant(
  owner: Knex,
  account: DatabaseAccountName | undefined,
): Promise<string[]> {
  const applied = await migrateLatest(owner)
  if (account) await grantApplicationAccess(owner, account)
  return applied
}
