import type { Knex } from 'knex'
import { createDb } from '../../server/db/knex'
import { totpCode } from './totp-code'

/** Second-factor keys of the people the factories made, with the database they live in. */
const keys = new Map<string, { secret: string; db: Knex }>()

export function rememberSecondFactorKey(db: Knex, email: string, secret: string): void {
  keys.set(email.toLowerCase(), { secret, db })
}

let testDb: Knex | undefined

function sharedTestDb(): Knex {
  const url = process.env.TEST_DATABASE_URL ?? process.env.E2E_DATABASE_URL
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run the tests through `npm test`')
  testDb ??= createDb(url, { min: 0, max: 1, idleTimeoutMillis: 1_000 })
  return testDb
}

/**
 * The person's current code, for the sign-in helpers. The server accepts each code once, and
 * tests sign the same person in many times a minute, so the helper first lets the server forget
 * the last code it accepted from this person (tests/api/second-factor.test.ts checks that a
 * reused code is refused without this).
 */
export async function currentCodeFor(
  email: string,
  options: { db?: Knex; secret?: string } = {},
): Promise<string> {
  const known = keys.get(email.toLowerCase())
  const db = options.db ?? known?.db ?? sharedTestDb()
  const row = (await db('users')
    .whereRaw('LOWER(email) = ?', [email.toLowerCase()])
    .first('id', 'secondFactorSecret')) as { id: number; secondFactorSecret: string | null }
  const secret = options.secret ?? known?.secret ?? row?.secondFactorSecret
  if (!row || !secret) throw new Error(`${email} has no second-factor key`)
  await db('users').where({ id: row.id }).update({ secondFactorLastStep: null })
  return totpCode(secret)
}
