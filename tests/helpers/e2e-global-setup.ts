import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import type { TestProject } from 'vitest/node'
import { createApp } from '../../server/app'
import { createDb } from '../../server/db/knex'
import { dropAllTables, migrateLatest } from '../../server/db/migrations'
import { createLocalStorage } from '../../server/storage/local-storage'
import { startLocalSmtp } from '../../server/mail/local-smtp'
import { createMailSender } from '../../server/mail/mail-sender'
import { createSmtpTransport } from '../../server/mail/smtp-transport'
import { seedDemoIfEmpty } from '../../seeds/demo'
import { testConfig } from './test-config'
import { applicationDatabaseUrl, grantTestApplicationAccount, testDatabaseUrl } from './test-db'

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
    demoPassword: string
    demoTotpSecret: string
  }
}

/** Serves the built client and the API on a free loopback port, on a freshly seeded database. */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const owner = createDb(testDatabaseUrl('E2E_DATABASE_URL'))
  await dropAllTables(owner)
  await migrateLatest(owner)
  await grantTestApplicationAccount(owner, 'E2E')
  // uploads of the browser journeys go to a folder of their own, never the checkout's
  const uploadsDir = mkdtempSync(join(tmpdir(), 'fractolog-e2e-uploads-'))
  const storage = createLocalStorage(uploadsDir)
  // demo mode, as `npm start`: the "Mail sent" page reads the local SMTP server's mailbox
  const config = testConfig({ uploadsDir, demoData: true })
  const { demoPassword: password, passwordCost, demoTotpSecret } = config
  await seedDemoIfEmpty(owner, { password, passwordCost, storage, totpSecret: demoTotpSecret })
  await owner.destroy()
  // the server runs on the application's account, as `npm start` runs it
  const db = createDb(applicationDatabaseUrl('E2E') ?? testDatabaseUrl('E2E_DATABASE_URL'))
  const clientDir = resolve(import.meta.dirname, '../../dist')
  const smtp = await startLocalSmtp(db)
  const sender = createMailSender({
    db,
    transport: createSmtpTransport(smtp.url),
    publicUrl: config.publicUrl,
    from: config.mail.from,
    policy: config.mail,
    pollMs: 1_000,
  })
  sender.start()
  const app = createApp({ db, config, clientDir, storage })
  const server = await new Promise<Server>((done) => {
    const listening = app.listen(0, '127.0.0.1', () => done(listening))
  })
  const { port } = server.address() as AddressInfo
  project.provide('baseUrl', `http://127.0.0.1:${port}`)
  project.provide('demoPassword', config.demoPassword)
  project.provide('demoTotpSecret', config.demoTotpSecret)
  return async () => {
    await new Promise((done) => server.close(done))
    await sender.stop()
    await smtp.stop()
    await db.destroy()
    rmSync(uploadsDir, { recursive: true, force: true })
  }
}
