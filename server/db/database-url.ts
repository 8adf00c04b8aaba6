import type { DatabaseAccountName } from './grants'
import {
  defaultLocalOptions,
  ensureApplicationAccount,
  ensureDatabase,
  startLocalMariadb,
  type LocalMariadb,
} from './local-mariadb'

export interface ResolvedDatabase {
  /** the owner's account: migrations, grants, seeds and the tests' resets */
  url: string
  /** the application's account: what the server connects with (the owner's when only one) */
  appUrl: string
  /** the application's account to grant to after migrating; none when one account does both */
  applicationAccount: DatabaseAccountName | undefined
  /** set when the private server was started for this process; stop it on exit */
  local: LocalMariadb | undefined
}

export interface ExternalDatabase {
  /** the application's URL (DATABASE_URL) */
  url: string | undefined
  /** the owner's URL (DATABASE_OWNER_URL); without it, the application's account does both */
  ownerUrl?: string | undefined
  /** where the application's account connects from, as MariaDB names it (DATABASE_APP_HOST) */
  applicationHost?: string | undefined
}

function external(given: ExternalDatabase & { url: string }): ResolvedDatabase {
  const ownerUrl = given.ownerUrl ?? given.url
  const applicationAccount =
    ownerUrl === given.url
      ? undefined
      : {
          user: decodeURIComponent(new URL(given.url).username),
          host: given.applicationHost ?? '%',
        }
  return { url: ownerUrl, appUrl: given.url, applicationAccount, local: undefined }
}

/**
 * An external URL wins; otherwise the private MariaDB on loopback is started (installed first if
 * needed) and the named database created on it, with an owner and an application account.
 */
export async function resolveDatabase(
  given: ExternalDatabase | string | undefined,
  database: string,
): Promise<ResolvedDatabase> {
  const wanted = typeof given === 'object' ? given : { url: given }
  if (wanted.url) return external({ ...wanted, url: wanted.url })
  const local = await startLocalMariadb(defaultLocalOptions())
  const ownerUrl = await ensureDatabase(local.options, {
    database,
    user: 'fractolog',
    password: process.env.LOCAL_DB_PASSWORD ?? 'fractolog-local-only',
  })
  const user = 'fractolog_app'
  const appUrl = await ensureApplicationAccount(local.options, {
    database,
    user,
    password: process.env.LOCAL_DB_APP_PASSWORD ?? 'fractolog-app-local-only',
  })
  return {
    url: ownerUrl,
    appUrl,
    applicationAccount: { user, host: '127.0.0.1' },
    local: local.startedHere ? local : undefined,
  }
}
