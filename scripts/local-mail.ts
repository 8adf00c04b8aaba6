// The local SMTP server of `npm start`: it runs in this process, beside the private MariaDB, and
// keeps what it receives in the app's database, where the "Mail sent" page reads it.
import type { Config } from '../server/config'
import { createDb } from '../server/db/knex'
import { startLocalSmtp } from '../server/mail/local-smtp'

export interface LocalMail {
  url: string
  stop(): Promise<void>
}

/** Starts it unless SMTP_URL names a real server; never in production, where mail is real. */
export async function startLocalMail(
  config: Config,
  databaseUrl: string,
): Promise<LocalMail | undefined> {
  if (config.mail.smtpUrl || config.nodeEnv === 'production') return undefined
  const db = createDb(databaseUrl, { min: 0, max: 2 })
  const smtp = await startLocalSmtp(db)
  console.log(
    `Local mail server at ${smtp.url}: e-mail goes there, not out. ` +
      (config.demoData
        ? `Administrators read it on the "Mail sent" page, ${config.publicUrl}/admin/mail`
        : 'Its "Mail sent" page is shown in demo mode only.'),
  )
  return {
    url: smtp.url,
    async stop() {
      await smtp.stop()
      await db.destroy()
    },
  }
}
