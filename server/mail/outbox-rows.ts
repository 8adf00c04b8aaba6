import type { Knex } from 'knex'
import type { StoredNotice } from '../services/notices/notice-kinds'

export interface OutboxRow {
  id: number
  toAddress: string
  toName: string
  payload: string
  messageId: string
  attempts: number
  queuedAt: Date
}

/** How long a claimed row is left alone; if the sender dies mid-send it is tried again then. */
const LEASE_MS = 10 * 60_000

/**
 * Takes up to `limit` due rows for this sender: rows another sender holds are skipped, and a
 * claimed row's next try moves past the lease, so it is never sent twice at once.
 */
export async function claimDueRows(db: Knex, now: Date, limit: number): Promise<OutboxRow[]> {
  return db.transaction(async (trx) => {
    const rows = (await trx('outbox_messages')
      .where({ status: 'queued' })
      .andWhere('nextAttemptAt', '<=', now)
      .orderBy('nextAttemptAt')
      .orderBy('id')
      .limit(limit)
      .forUpdate()
      .skipLocked()
      .select(
        'id',
        'toAddress',
        'toName',
        'payload',
        'messageId',
        'attempts',
        'queuedAt',
      )) as OutboxRow[]
    if (rows.length === 0) return []
    await trx('outbox_messages')
      .whereIn(
        'id',
        rows.map((row) => row.id),
      )
      .update({ nextAttemptAt: new Date(now.getTime() + LEASE_MS) })
    return rows
  })
}

export const storedNoticeOf = (row: OutboxRow) => JSON.parse(row.payload) as StoredNotice

export async function recordSent(db: Knex, row: OutboxRow, at: Date): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('outbox_messages')
      .where({ id: row.id })
      .update({
        status: 'sent',
        attempts: row.attempts + 1,
        sentAt: at,
        nextAttemptAt: null,
        lastError: null,
        updatedAt: trx.fn.now(),
      })
    await trx('outbox_attempts').insert({
      outboxMessageId: row.id,
      attemptedAt: at,
      outcome: 'sent',
    })
  })
}

/** A failed try: queued again for `nextAt`, or failed for good when there is none. */
export async function recordFailed(
  db: Knex,
  row: OutboxRow,
  at: Date,
  error: string,
  nextAt: Date | null,
): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('outbox_messages')
      .where({ id: row.id })
      .update({
        status: nextAt ? 'queued' : 'failed',
        attempts: row.attempts + 1,
        nextAttemptAt: nextAt,
        lastError: error,
        updatedAt: trx.fn.now(),
      })
    await trx('outbox_attempts').insert({
      outboxMessageId: row.id,
      attemptedAt: at,
      outcome: 'failed',
      error,
    })
  })
}
