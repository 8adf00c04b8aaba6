import type { Knex } from 'knex'
import type { OutboxAttempt, OutboxMessage, OutboxStatus } from '../../shared/schemas/mail'
import { Conflict, NotFound } from '../errors'

interface MessageRow {
  id: number
  kind: string
  caseId: number | null
  toAddress: string
  toName: string
  subject: string
  messageId: string
  status: OutboxStatus
  queuedAt: Date
  nextAttemptAt: Date | null
  sentAt: Date | null
  lastError: string | null
}

interface AttemptRow {
  outboxMessageId: number
  attemptedAt: Date
  outcome: 'sent' | 'failed'
  error: string | null
}

const iso = (value: Date | null) => value?.toISOString() ?? null
const LIST_LIMIT = 200

function toView(row: MessageRow, attempts: AttemptRow[]): OutboxMessage {
  const own: OutboxAttempt[] = attempts
    .filter((attempt) => attempt.outboxMessageId === row.id)
    .map(({ attemptedAt, outcome, error }) => ({
      attemptedAt: attemptedAt.toISOString(),
      outcome,
      error,
    }))
  return {
    id: row.id,
    kind: row.kind,
    caseId: row.caseId,
    to: row.toAddress,
    toName: row.toName,
    subject: row.subject,
    messageId: row.messageId,
    status: row.status,
    attempts: own,
    queuedAt: row.queuedAt.toISOString(),
    nextAttemptAt: iso(row.nextAttemptAt),
    sentAt: iso(row.sentAt),
    lastError: row.lastError,
  }
}

/** The outbox for administrators, newest first, each message with its tries. */
export async function listOutbox(
  db: Knex,
  filter: { status?: OutboxStatus; ids?: number[] } = {},
): Promise<OutboxMessage[]> {
  const query = db('outbox_messages').orderBy('id', 'desc').limit(LIST_LIMIT)
  if (filter.status) query.where({ status: filter.status })
  if (filter.ids) query.whereIn('id', filter.ids)
  const rows = (await query) as MessageRow[]
  if (rows.length === 0) return []
  const attempts = (await db('outbox_attempts')
    .whereIn(
      'outboxMessageId',
      rows.map((row) => row.id),
    )
    .orderBy('id')) as AttemptRow[]
  return rows.map((row) => toView(row, attempts))
}

/**
 * Queues a message again for the next pass, keeping its Message-ID so the recipient can tell a
 * repeat; the give-up time counts from now.
 */
export async function resendOutboxMessage(
  db: Knex,
  id: number,
  now: Date = new Date(),
): Promise<OutboxMessage> {
  await db.transaction(async (trx) => {
    const row = (await trx('outbox_messages').where({ id }).forUpdate().first('status')) as
      { status: OutboxStatus } | undefined
    if (!row) throw new NotFound('No such message in the outbox.')
    if (row.status === 'queued') throw new Conflict('This message is waiting to be sent already.')
    await trx('outbox_messages')
      .where({ id })
      .update({ status: 'queued', queuedAt: now, nextAttemptAt: now, updatedAt: trx.fn.now() })
  })
  const [message] = await listOutbox(db, { ids: [id] })
  return message as OutboxMessage
}
