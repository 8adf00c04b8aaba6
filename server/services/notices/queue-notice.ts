import { randomUUID } from 'node:crypto'
import type { Knex } from 'knex'
import type { Notice, Recipient, StoredNotice } from './notice-kinds'
import { caseFactsOf, kindFacts } from './notice-facts'
import { optedOut } from '../notice-settings'
import { caseFacts, recipientsOf } from './recipients'
import { oneLine, renderNotice } from './render'

/** A Message-ID made once, when the row is written, so every try sends the same one. */
const newMessageId = () => `<${randomUUID()}@outbox.fractolog.invalid>`

/** The recipients who have not turned this kind of notice off (essential ones always stay). */
async function wantingIt(db: Knex, notice: Notice, recipients: Recipient[]): Promise<Recipient[]> {
  const ids = recipients.flatMap((recipient) =>
    recipient.personId === null ? [] : [recipient.personId],
  )
  const off = await optedOut(db, notice.kind, ids)
  return recipients.filter(
    (recipient) => recipient.personId === null || !off.has(recipient.personId),
  )
}

/**
 * Writes one outbox row per recipient of `notice`. Call it with the transaction of the action
 * that causes the notice: the rows commit or roll back with it, and nothing is sent here, so the
 * action never waits for mail. People who turned the kind off get no row. Answers the ids of the rows written (none without a recipient).
 */
export async function queueNotice(
  db: Knex,
  notice: Notice,
  clock: () => Date = () => new Date(),
): Promise<number[]> {
  const found = await caseFacts(db, notice.caseId)
  const recipients = await wantingIt(db, notice, await recipientsOf(db, notice, found))
  if (recipients.length === 0) return []
  const extra = await kindFacts(db, notice)
  const now = clock()
  const rows = recipients.map((recipient) => {
    const stored: StoredNotice = {
      kind: notice.kind,
      facts: { ...caseFactsOf(found), ...extra, recipientName: recipient.name },
    }
    return {
      kind: notice.kind,
      caseId: found.id,
      recipientId: recipient.personId,
      toAddress: recipient.address,
      toName: oneLine(recipient.name, 191),
      // the subject needs no link, so the list of the outbox can show it before sending
      subject: renderNotice(stored, '').subject,
      payload: JSON.stringify(stored),
      messageId: newMessageId(),
      status: 'queued',
      queuedAt: now,
      nextAttemptAt: now,
    }
  })
  const ids: number[] = []
  // one insert per row: MariaDB answers only the first id of a multi-row insert
  for (const row of rows) {
    const [id] = (await db('outbox_messages').insert(row)) as number[]
    ids.push(id as number)
  }
  return ids
}
