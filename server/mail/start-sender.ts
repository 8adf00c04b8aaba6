import type { Knex } from 'knex'
import type { Config } from '../config'
import { createMailSender, type MailSender } from './mail-sender'
import { createSmtpTransport } from './smtp-transport'

export type { MailSender } from './mail-sender'

/** The sender on SMTP_URL, polling; without SMTP_URL notices wait in the outbox. */
export function startMailSender(db: Knex, config: Config): MailSender | undefined {
  const { smtpUrl, from, retryMinutes, giveUpHours, pollSeconds } = config.mail
  if (!smtpUrl) {
    console.warn('SMTP_URL is not set: e-mail notices wait in the outbox until it is.')
    return undefined
  }
  const sender = createMailSender({
    db,
    transport: createSmtpTransport(smtpUrl),
    publicUrl: config.publicUrl,
    from,
    policy: { retryMinutes, giveUpHours },
    pollMs: pollSeconds * 1000,
  })
  sender.start()
  return sender
}
