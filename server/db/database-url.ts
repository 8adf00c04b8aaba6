import {
  defaultLocalOptions,
  ensureDatabase,
  startLocalMariadb,
  type LocalMariadb,
} from './local-mariadb'

export interface ResolvedDatabase {
  url: string
  /** set when the private server was started for this process; stop it on exit */
  local: LocalMariadb | undefined
}

/**
 * An external URL wins; otherwise the private MariaDB on loopback is started (installed first if
 * needed) and the named database created on it.
 */
export async function resolveDatabase(
  externalUrl: string | undefined,
  database: string,
): Promise<ResolvedDatabase> {
  if (externalUrl) return { url: externalUrl, local: undefined }
  const local = await startLocalMariadb(defaultLocalOptions())
  const url = await ensureDatabase(local.options, {
    database,
    user: 'fractolog',
    password: process.env.LOCAL_DB_PASSWORD ?? 'fractolog-local-only',
  })
  return { url, local: local.startedHere ? local : undefined }
}
