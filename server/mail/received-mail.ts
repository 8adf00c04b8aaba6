import type { Knex } from 'knex'
import type { ParsedMail } from 'mailparser'

/** One message as the "Mail sent" page lists it. */
export interface ReceivedMail {
  id: number
  messageId: string | null
  to: string
  subject: string
  text: string
  receivedAt: string
}

const addressesOf = (parsed: ParsedMail): string => {
  const to = parsed.to
  if (!to) return ''
  return (Array.isArray(to) ? to : [to]).map((entry) => entry.text).join(', ')
}

/** Keeps what the local SMTP server received: the raw message and what mailparser read. */
export async function saveReceivedMail(
  db: Knex,
  raw: Buffer,
  parsed: ParsedMail,
  at: Date,
): Promise<void> {
  await db('received_mail').insert({
    messageId: parsed.messageId ?? null,
    toAddresses: addressesOf(parsed),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    raw,
    receivedAt: at,
  })
}

/** Newest first. */
export async function listReceivedMail(db: Knex, limit = 200): Promise<ReceivedMail[]> {
  const rows = (await db('received_mail')
    .orderBy('receivedAt', 'desc')
    .orderBy('id', 'desc')
    .limit(limit)
    .select('id', 'messageId', 'toAddresses', 'subject', 'text', 'receivedAt')) as {
    id: number
    messageId: string | null
    toAddresses: string
    subject: string
    text: string
    receivedAt: Date
  }[]
  return rows.map((row) => ({
    id: row.id,
    messageId: row.messageId,
    to: row.toAddresses,
    subject: row.subject,
    text: row.text,
    receivedAt: row.receivedAt.toISOString(),
  }))
}
