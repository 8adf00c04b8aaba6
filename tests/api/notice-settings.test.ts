import request from 'supertest'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import type { Notice } from '../../server/services/notices/notice-kinds'
import { queueNotice } from '../../server/services/notices/queue-notice'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { freshMailRig, type MailRig } from '../helpers/mail'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'admin' | 'lead' | 'reviewer' | 'client' | 'client2'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let rig: MailRig

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
    client2: { roles: ['client'], organisationId: org },
  })
  sessions = await signInAll(app, people)
  caseId = (
    await makeCase(db, org, people.admin.id, {
      leadInvestigatorId: people.lead.id,
      reviewerId: people.reviewer.id,
    })
  ).id
})
beforeEach(async () => {
  await db('notice_opt_outs').delete()
  ;({ rig } = await freshMailRig(db))
  return () => rig.close()
})
afterAll(() => db.destroy())

const settingsOf = async (key: Key) =>
  (await sessions[key].get('/api/settings/notices').expect(200)).body.data as {
    kind: string
    essential: boolean
    on: boolean
  }[]

async function deliver(notice: Notice): Promise<string[]> {
  await db.transaction((trx) => queueNotice(trx, notice))
  await rig.sender.runOnce()
  const rows = (await db('received_mail').orderBy('id')) as { toAddresses: string }[]
  return rows.map((row) => /<([^>]+)>/.exec(row.toAddresses)?.[1] ?? row.toAddresses).sort()
}

describe('a person chooses their own e-mail notices', () => {
  it('staff see the case-work notices, clients their reports’ notices, all on at first', async () => {
    const staff = await settingsOf('reviewer')
    expect(staff.map((s) => s.kind)).toEqual([
      'assigned',
      'review_requested',
      'revisions_requested',
      'approved',
      'client_question',
    ])
    expect(staff.every((s) => s.on && !s.essential)).toBe(true)
    const client = await settingsOf('client')
    expect(client).toEqual([
      expect.objectContaining({ kind: 'report_issued', essential: true, on: true }),
      expect.objectContaining({ kind: 'answer', essential: false, on: true }),
    ])
  })

  it('turns a notice off and on again, and the choice is kept', async () => {
    const saved = await sessions.reviewer
      .put('/api/settings/notices', { off: ['review_requested'] })
      .expect(200)
    expect(saved.body.data).toContainEqual(
      expect.objectContaining({ kind: 'review_requested', on: false }),
    )
    const again = await settingsOf('reviewer')
    expect(again.filter((s) => !s.on).map((s) => s.kind)).toEqual(['review_requested'])
    // one person's choice is theirs alone
    expect((await settingsOf('lead')).every((s) => s.on)).toBe(true)
    await sessions.reviewer.put('/api/settings/notices', { off: [] }).expect(200)
    expect((await settingsOf('reviewer')).every((s) => s.on)).toBe(true)
  })

  it('refuses to turn off the essential notice, or an unknown one, and changes nothing', async () => {
    await sessions.client.put('/api/settings/notices', { off: ['answer'] }).expect(200)
    for (const body of [
      { off: ['report_issued'] },
      { off: ['answer', 'report_issued'] },
      { off: ['no_such_notice'] },
      { off: 'answer' },
      { off: [], extra: true },
    ]) {
      const refused = await sessions.client.put('/api/settings/notices', body).expect(400)
      expect(refused.body.error.message).toBeTruthy()
    }
    const essential = await sessions.client
      .put('/api/settings/notices', { off: ['report_issued'] })
      .expect(400)
    expect(JSON.stringify(essential.body.error)).toContain('essential')
    const now = await settingsOf('client')
    expect(now.filter((s) => !s.on).map((s) => s.kind)).toEqual(['answer'])
  })

  it('is only for the signed-in person', async () => {
    await request(app).get('/api/settings/notices').expect(401)
  })
})

describe('the local SMTP server receives nothing non-essential for a person who turned it off', () => {
  it('an opted-out reviewer gets no review request; another kind still reaches them', async () => {
    await sessions.reviewer.put('/api/settings/notices', { off: ['review_requested'] }).expect(200)
    expect(await deliver({ kind: 'review_requested', caseId })).toEqual([])
    expect(await db('outbox_messages').count({ n: '*' }).first()).toEqual({ n: 0 })
    expect(
      await deliver({ kind: 'assigned', caseId, personId: people.reviewer.id, part: 'reviewer' }),
    ).toEqual([people.reviewer.email])
  })

  it('an opted-out client gets no answer, but the issued report reaches every client', async () => {
    await sessions.client2.put('/api/settings/notices', { off: ['answer'] }).expect(200)
    const answer = { kind: 'answer', caseId, askedById: people.client2.id, answer: 'Friday.' }
    expect(await deliver(answer as Notice)).toEqual([])
    expect(await deliver({ kind: 'report_issued', caseId, reportNumber: 'R-2026-0101' })).toEqual(
      [people.client.email, people.client2.email].sort(),
    )
  })

  it('the notice comes again once the person turns it back on', async () => {
    await sessions.lead.put('/api/settings/notices', { off: ['approved'] }).expect(200)
    expect(await deliver({ kind: 'approved', caseId })).toEqual([])
    await sessions.lead.put('/api/settings/notices', { off: [] }).expect(200)
    expect(await deliver({ kind: 'approved', caseId })).toEqual([people.lead.email])
  })
})
