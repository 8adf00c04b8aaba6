import { createHash } from 'node:crypto'
import type { Knex } from 'knex'
import { AppError } from '../errors'

/** How long an answer is kept for a key. */
export const IDEMPOTENCY_KEY_HOURS = 24

export interface Answer {
  status: number
  body: unknown
}

export interface KeyClaim {
  personId: number
  key: string
  /** what the request was: the same key with another fingerprint is refused */
  fingerprint: string
  now: Date
}

interface StoredKey {
  requestHash: string
  responseStatus: number
  responseBody: string
}

const KEY_INDEX = 'idempotency_keys_user_id_client_key_unique'

/** The SHA-256 of a request's method and path and its parsed body (keys in schema order). */
export function fingerprintOf(request: string, body: unknown): string {
  return createHash('sha256')
    .update(`${request}\n${JSON.stringify(body)}`)
    .digest('hex')
}

class KeyTaken extends Error {}

function isOurDuplicate(error: unknown): boolean {
  const { code, sqlMessage } = error as { code?: string; sqlMessage?: string }
  return code === 'ER_DUP_ENTRY' && (sqlMessage ?? '').endsWith(`'${KEY_INDEX}'`)
}

/**
 * Does `work` once per person and key within 24 hours, and answers every repeat with the first
 * answer. The key is claimed first, in the same transaction as the work: a second request with
 * the same key waits on that row until the first commits (then gets its answer) or rolls back
 * (then does the work itself). A failed request stores nothing, so its key may be used again.
 */
export async function onceForKey(
  db: Knex,
  claim: KeyClaim,
  work: (trx: Knex.Transaction) => Promise<Answer>,
): Promise<Answer & { replayed: boolean }> {
  const { personId: userId, key: clientKey, fingerprint: requestHash, now } = claim
  const expired = new Date(now.getTime() - IDEMPOTENCY_KEY_HOURS * 3_600_000)
  await db('idempotency_keys').where('createdAt', '<', expired).delete()
  try {
    return await db.transaction(async (trx) => {
      await trx('idempotency_keys')
        .insert({ userId, clientKey, requestHash, createdAt: now })
        .catch((error: unknown) => {
          throw isOurDuplicate(error) ? new KeyTaken() : error
        })
      const answer = await work(trx)
      await trx('idempotency_keys')
        .where({ userId, clientKey })
        .update({ responseStatus: answer.status, responseBody: JSON.stringify(answer.body) })
      return { ...answer, replayed: false }
    })
  } catch (error) {
    if (!(error instanceof KeyTaken)) throw error
    return replay(db, claim)
  }
}

async function replay(db: Knex, claim: KeyClaim): Promise<Answer & { replayed: boolean }> {
  const stored = (await db('idempotency_keys')
    .where({ userId: claim.personId, clientKey: claim.key })
    .first('requestHash', 'responseStatus', 'responseBody')) as StoredKey | undefined
  if (!stored || stored.requestHash !== claim.fingerprint) {
    throw new AppError(
      'idempotency_key_reused',
      'This Idempotency-Key was already used for a different request. Send a new key.',
    )
  }
  return {
    status: stored.responseStatus,
    body: JSON.parse(stored.responseBody) as unknown,
    replayed: true,
  }
}
