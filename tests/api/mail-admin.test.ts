import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeCase, makeOrganisation, makePeople, makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn, signInAll } from '../helpers/api-session'
import { freshMailRig, type MailRig, outboxRows, receivedBy, type TestClock } from '../helpers/mail'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const demoApp = createApp({ db, config: testConfig({ demoData: true }), clientDir: '/nonexistent' })
const plainApp = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'admin' | 'lead' | 'lab' | 'reviewer' | 'client'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let organisationId: number
let clock: TestClock
let rig: MailRig

beforeAll(async () => {
  await resetDatabase(db)
  organisationId = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId },
  })
  sessions = await signInAll(demoApp, people)
})
beforeEach(async () => {
  ;({ clock, rig } = await freshMailRig(db))
  return () => rig.close()
})
afterAll(() => db.destroy())

describe('GET /api/admin/mail (demo mode)', () => {
  it('shows administrators what the local SMTP server received, newest first', async () => {
    await makeCase(db, organisationId, people.admin.id, { leadInvestigatorId: people.lead.id })
    await rig.sender.runOnce()
    clock.advanceMinutes(1)
    await makeCase(db, organisationId, people.admin.id, { reviewerId: people.reviewer.id })
    await rig.sender.runOnce()
    const response = await sessions.admin.get('/api/admin/mail').expect(200)
    const items = response.body.data as {
      to: string
      subject: string
      text: string
      receivedAt: string
    }[]
    expect(items.map((item) => item.to)).toEqual([
      expect.stringContaining(people.reviewer.email),
      expect.stringContaining(people.lead.email),
    ])
    expect(items[0]!.subject).toMatch(/^FL-\d{4}-\d{4}: you are the reviewer/)
    expect(items[0]!.text).toContain('You were made the reviewer of case')
    expect(Date.parse(items[0]!.receivedAt)).toBeGreaterThanOrEqual(
      Date.parse(items[1]!.receivedAt),
    )
  })

  it('refuses everyone but administrators, and is not there outside demo mode', async () => {
    for (const key of ['lead', 'lab', 'reviewer', 'client'] as const) {
      expect((await sessions[key].get('/api/admin/mail')).status, key).toBe(403)
      expect((await sessions[key].get('/api/admin/outbox')).status, key).toBe(403)
    }
    expect((await new ApiSession(demoApp).get('/api/admin/mail')).status).toBe(401)
    const admin = await signedIn(plainApp, people.admin.email, people.admin.password)
    expect((await admin.get('/api/admin/mail')).status).toBe(404)
    expect((await admin.get('/api/admin/outbox')).status).toBe(200)
  })
})

describe('the outbox for administrators', () => {
  it('lists queued, sent and failed messages with their tries, and filters by status', async () => {
    await makeCase(db, organisationId, people.admin.id, {
      leadInvestigatorId: people.lead.id,
      labTechnicianId: people.lab.id,
    })
    await rig.sender.runOnce()
    await db('outbox_messages').where({ toAddress: people.lab.email }).update({ status: 'failed' })
    await makeCase(db, organisationId, people.admin.id, { reviewerId: people.reviewer.id })
    const all = (await sessions.admin.get('/api/admin/outbox').expect(200)).body.data as {
      to: string
      status: string
      attempts: { outcome: string }[]
    }[]
    expect(all.map((item) => [item.to, item.status, item.attempts.length])).toEqual([
      [people.reviewer.email, 'queued', 0],
      [people.lab.email, 'failed', 1],
      [people.lead.email, 'sent', 1],
    ])
    const failed = await sessions.admin.get('/api/admin/outbox?status=failed').expect(200)
    expect(failed.body.data.map((item: { to: string }) => item.to)).toEqual([people.lab.email])
    expect((await sessions.admin.get('/api/admin/outbox?status=lost')).status).toBe(400)
  })

  it('resends a message with the same Message-ID, so the repeat can be recognised', async () => {
    await makeCase(db, organisationId, people.admin.id, { leadInvestigatorId: people.lead.id })
    await rig.sender.runOnce()
    const [row] = await outboxRows(db)
    const resent = await sessions.admin.post(`/api/admin/outbox/${row!.id}/resend`).expect(200)
    expect(resent.body.data).toMatchObject({ status: 'queued', messageId: row!.messageId })
    expect((await sessions.admin.post(`/api/admin/outbox/${row!.id}/resend`)).status).toBe(409)
    expect(await rig.sender.runOnce()).toEqual({ sent: 1, failed: 0 })
    const mail = await receivedBy(db, people.lead.email)
    expect(mail.map((entry) => entry.parsed.messageId)).toEqual([row!.messageId, row!.messageId])
    const [after] = await outboxRows(db)
    expect(after).toMatchObject({ status: 'sent', attempts: 2 })
  })

  it('lets only administrators resend, and answers 404 for an unknown message', async () => {
    await makeCase(db, organisationId, people.admin.id, { leadInvestigatorId: people.lead.id })
    await rig.sender.runOnce()
    const [row] = await outboxRows(db)
    for (const key of ['lead', 'lab', 'reviewer', 'client'] as const) {
      expect((await sessions[key].post(`/api/admin/outbox/${row!.id}/resend`)).status, key).toBe(
        403,
      )
    }
    expect((await sessions.admin.post('/api/admin/outbox/999999/resend')).status).toBe(404)
    expect(await outboxRows(db)).toMatchObject([{ status: 'sent', attempts: 1 }])
  })
})

describe('headers cannot be injected', () => {
  it('a name with CR/LF and a very long title add no header of their own', async () => {
    const eve = await makePerson(db, ['investigator'])
    await db('users')
      .where({ id: eve.id })
      .update({ name: 'Eve\r\nBcc: victim@example.test\r\nX-Injected: yes' })
    const title = `Shaft\r\nX-Title-Injected: yes ${'and a very long title '.repeat(9)}`.slice(
      0,
      191,
    )
    const record = await makeCase(db, organisationId, people.admin.id)
    // straight into the row: whatever the form allows, the mail must stay safe
    await db('cases').where({ id: record.id }).update({ title })
    await sessions.admin
      .patch(`/api/cases/${record.id}`, { version: record.version, leadInvestigatorId: eve.id })
      .expect(200)
    expect(await rig.sender.runOnce()).toEqual({ sent: 1, failed: 0 })
    const [mail] = await receivedBy(db, eve.email)
    const head = mail!.raw.split('\r\n\r\n')[0]!
    // a header starts at the beginning of a line; folded continuations start with white space
    const names = head
      .split('\r\n')
      .filter((line) => !/^[ \t]/.test(line))
      .map((line) => line.slice(0, line.indexOf(':')).toLowerCase())
    expect(
      names.filter((name) => ['bcc', 'x-injected', 'x-title-injected'].includes(name)),
    ).toEqual([])
    expect(names.filter((name) => name === 'to')).toHaveLength(1)
    expect(names.filter((name) => name === 'subject')).toHaveLength(1)
    expect(mail!.parsed.bcc).toBeUndefined()
    expect(mail!.parsed.to).toMatchObject({ value: [{ address: eve.email }] })
    expect(mail!.parsed.subject).toMatch(/^FL-\d{4}-\d{4}: you are the lead investigator — Shaft/)
  })
})
