import type { Knex } from 'knex'
import { simpleParser, type ParsedMail } from 'mailparser'
import { startLocalSmtp, type LocalSmtp } from '../../server/mail/local-smtp'
import { createMailSender } from '../../server/mail/mail-sender'
import { createSmtpTransport } from '../../server/mail/smtp-transport'

export const PUBLIC_URL = 'https://fractolog.example.test'

/** A clock the test moves by hand. */
// A minute ahead of the real clock: rows the API queues on the real clock are due for the
// sender however long the request took on a busy machine.
export function testClock(start = new Date(Date.now() + 60_000)) {
  let now = start.getTime()
  return {
    now: () => new Date(now),
    advanceMinutes: (minutes: number) => void (now += minutes * 60_000),
  }
}

/**
 * The real local SMTP server on a free port and a sender pointed at it, driven by `clock`; the
 * test runs the sender's passes itself. `stopSmtp`/`restartSmtp` take the server away and bring
 * it back on the same port.
 */
export async function mailRig(db: Knex, clock: () => Date) {
  let smtp: LocalSmtp = await startLocalSmtp(db)
  const port = smtp.port
  const sender = createMailSender({
    db,
    transport: createSmtpTransport(smtp.url),
    publicUrl: PUBLIC_URL,
    from: 'Fractolog <notices@fractolog.example.test>',
    policy: { retryMinutes: [1, 5, 30, 60], giveUpHours: 24 },
    clock,
    log: () => undefined,
  })
  return {
    sender,
    stopSmtp: () => smtp.stop(),
    restartSmtp: async () => {
      smtp = await startLocalSmtp(db, { port })
    },
    close: async () => {
      await sender.stop()
      await smtp.stop()
    },
  }
}

/**
 * For a test that starts with no mail: empties the outbox, its attempts and the local mailbox,
 * then starts a rig on a new hand-moved clock. Close it (`rig.close()`) after the test.
 */
export async function freshMailRig(db: Knex) {
  await db('outbox_attempts').delete()
  await db('outbox_messages').delete()
  await db('received_mail').delete()
  const clock = testClock()
  const rig = await mailRig(db, clock.now)
  return { clock, rig }
}

export type TestClock = ReturnType<typeof testClock>
export type MailRig = Awaited<ReturnType<typeof mailRig>>

export interface Delivered {
  to: string
  raw: string
  parsed: ParsedMail
}

/** What the local SMTP server received for `address`, oldest first, parsed again from raw. */
export async function receivedBy(db: Knex, address: string): Promise<Delivered[]> {
  const rows = (await db('received_mail')
    .where('toAddresses', 'like', `%${address}%`)
    .orderBy('id')
    .select('toAddresses', 'raw')) as { toAddresses: string; raw: Buffer }[]
  return Promise.all(
    rows.map(async (row) => ({
      to: row.toAddresses,
      raw: row.raw.toString('utf8'),
      parsed: await simpleParser(row.raw),
    })),
  )
}

export async function outboxRows(db: Knex) {
  return (await db('outbox_messages').orderBy('id')) as {
    id: number
    kind: string
    toAddress: string
    status: string
    attempts: number
    messageId: string
    nextAttemptAt: Date | null
  }[]
}
