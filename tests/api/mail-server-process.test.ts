import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startLocalSmtp, type LocalSmtp } from '../../server/mail/local-smtp'
import { createMailSender } from '../../server/mail/mail-sender'
import { createSmtpTransport } from '../../server/mail/smtp-transport'
import { makeCase, makeOrganisation, makePerson } from '../factories'
import { receivedBy } from '../helpers/mail'
import { startServerProcess } from '../helpers/server-process'
import { createTestDb, resetDatabase, testDatabaseUrl } from '../helpers/test-db'

const db = createTestDb()
let smtp: LocalSmtp
let organisationId: number
let adminId: number

beforeAll(async () => {
  await resetDatabase(db)
  smtp = await startLocalSmtp(db)
  organisationId = await makeOrganisation(db)
  adminId = (await makePerson(db, ['admin'])).id
})
afterAll(async () => {
  await smtp.stop()
  await db.destroy()
})

const pause = (ms: number) => new Promise((done) => setTimeout(done, ms))

async function waitFor(check: () => Promise<boolean>, what: string) {
  const deadline = Date.now() + 15_000
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`gave up waiting: ${what}`)
    await pause(50)
  }
}

const statusOf = async (address: string) =>
  (
    (await db('outbox_messages').where({ toAddress: address }).first('status')) as {
      status: string
    }
  ).status

describe('the sender in a running server', () => {
  it('stop() waits for the pass in progress, and nothing is sent after it', async () => {
    const first = await makePerson(db, ['investigator'])
    const sender = createMailSender({
      db,
      transport: createSmtpTransport(smtp.url),
      publicUrl: 'https://fractolog.example.test',
      from: 'Fractolog <notices@fractolog.example.test>',
      policy: { retryMinutes: [1], giveUpHours: 1 },
      pollMs: 20,
    })
    sender.start()
    await makeCase(db, organisationId, adminId, { leadInvestigatorId: first.id })
    await waitFor(async () => (await statusOf(first.email)) === 'sent', 'first message sent')
    await sender.stop()
    const second = await makePerson(db, ['investigator'])
    await makeCase(db, organisationId, adminId, { leadInvestigatorId: second.id })
    await pause(300)
    expect(await statusOf(second.email)).toBe('queued')
    expect(await receivedBy(db, second.email)).toHaveLength(0)
    await db('outbox_messages').where({ toAddress: second.email }).delete()
  })

  it('server/index.ts delivers on SMTP_URL and shuts down cleanly on SIGTERM', async () => {
    const uploadsDir = mkdtempSync(join(tmpdir(), 'fractolog-mail-uploads-'))
    const server = await startServerProcess(testDatabaseUrl(), uploadsDir, {
      SMTP_URL: smtp.url,
      MAIL_POLL_SECONDS: '0.1',
      PUBLIC_URL: 'https://lab.example.test',
    })
    try {
      const lead = await makePerson(db, ['investigator'])
      const record = await makeCase(db, organisationId, adminId, { leadInvestigatorId: lead.id })
      await waitFor(async () => (await receivedBy(db, lead.email)).length === 1, 'delivery')
      const [mail] = await receivedBy(db, lead.email)
      expect(mail!.parsed.text).toContain(`https://lab.example.test/cases/${record.id}\n`)
      server.child.kill('SIGTERM')
      expect(await server.exited).toBe(0)
      expect(server.output()).not.toMatch(/Error|Unhandled/)
    } finally {
      if (server.alive()) server.child.kill('SIGKILL')
      rmSync(uploadsDir, { recursive: true, force: true })
    }
  }, 60_000) // a server process starting from source on a busy machine
})
