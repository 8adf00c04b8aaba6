import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { createCaseService } from '../../server/services/cases'
import type { Role } from '../../shared/schemas/roles'
import { makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import {
  freshMailRig,
  type MailRig,
  outboxRows,
  PUBLIC_URL,
  receivedBy,
  type TestClock,
} from '../helpers/mail'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'admin' | 'lead' | 'lead2' | 'lab' | 'reviewer' | 'reviewer2'
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
    lead2: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    reviewer2: ['reviewer'],
  })
  sessions = await signInAll(app, people)
})
beforeEach(async () => {
  ;({ clock, rig } = await freshMailRig(db))
  return () => rig.close()
})
afterAll(() => db.destroy())

const newCase = (parts: Record<string, number | null>) => ({
  title: 'Fractured drive shaft',
  organisationId,
  component: 'Drive shaft',
  material: 'EN 10083-3 42CrMo4',
  ...parts,
})

async function caseWithLeadAndLab() {
  const response = await sessions.admin
    .post(
      '/api/cases',
      newCase({ leadInvestigatorId: people.lead.id, labTechnicianId: people.lab.id }),
    )
    .expect(201)
  return response.body.data as { id: number; number: string; version: number }
}

describe('assignment notices', () => {
  it('a new case tells its lead, lab technician and reviewer once each, with a link to it', async () => {
    const parts = {
      leadInvestigatorId: people.lead.id,
      labTechnicianId: people.lab.id,
      reviewerId: people.reviewer.id,
    }
    const created = await sessions.admin.post('/api/cases', newCase(parts)).expect(201)
    const { id, number } = created.body.data as { id: number; number: string }
    expect(await rig.sender.runOnce()).toEqual({ sent: 3, failed: 0 })
    const expected: [Key, string][] = [
      ['lead', 'lead investigator'],
      ['lab', 'lab technician'],
      ['reviewer', 'reviewer'],
    ]
    for (const [key, part] of expected) {
      const mail = await receivedBy(db, people[key].email)
      expect(mail, key).toHaveLength(1)
      const { parsed } = mail[0]!
      expect(parsed.subject).toMatch(new RegExp(`^${number}: you are the ${part}`))
      expect(parsed.text).toContain(`${PUBLIC_URL}/cases/${id}\n`)
      expect(parsed.html).toContain(`href="${PUBLIC_URL}/cases/${id}"`)
    }
    for (const key of ['admin', 'lead2', 'reviewer2'] as const) {
      expect(await receivedBy(db, people[key].email), key).toHaveLength(0)
    }
    expect(await rig.sender.runOnce()).toEqual({ sent: 0, failed: 0 })
  })

  it('an edit of the case record tells only the person newly given a part', async () => {
    const created = await caseWithLeadAndLab()
    await rig.sender.runOnce()
    await db('received_mail').delete()
    await sessions.lead
      .patch(`/api/cases/${created.id}`, {
        version: created.version,
        reviewerId: people.reviewer2.id,
        title: 'Fractured drive shaft, second look',
      })
      .expect(200)
    expect(await rig.sender.runOnce()).toEqual({ sent: 1, failed: 0 })
    const mail = await receivedBy(db, people.reviewer2.email)
    expect(mail).toHaveLength(1)
    expect(mail[0]!.parsed.subject).toMatch(new RegExp(`^${created.number}: you are the reviewer`))
    expect(await db('received_mail').count({ n: '*' })).toEqual([{ n: 1 }])
  })

  it('a lead who takes a case on is not told of it', async () => {
    const created = (await sessions.admin.post('/api/cases', newCase({})).expect(201)).body.data
    await sessions.lead2
      .patch(`/api/cases/${created.id}`, {
        version: created.version,
        leadInvestigatorId: people.lead2.id,
      })
      .expect(200)
    expect(await outboxRows(db)).toHaveLength(0)
  })

  it('an action that rolls back leaves no notice behind', async () => {
    const created = await caseWithLeadAndLab()
    await db('outbox_messages').delete()
    const cases = createCaseService()
    const actor = { id: people.admin.id, roles: ['admin'] as Role[], organisationId: null }
    const later = new Error('a later step of the same action failed')
    await expect(
      db.transaction(async (trx) => {
        await cases.update({ actor, db: trx }, created.id, {
          version: created.version,
          reviewerId: people.reviewer.id,
        })
        expect(await trx('outbox_messages').count({ n: '*' })).toEqual([{ n: 1 }])
        throw later
      }),
    ).rejects.toBe(later)
    expect(await outboxRows(db)).toHaveLength(0)
    expect(await rig.sender.runOnce()).toEqual({ sent: 0, failed: 0 })
    expect(await receivedBy(db, people.reviewer.email)).toHaveLength(0)
  })
})

describe('when the SMTP server is down', () => {
  it('actions still succeed, messages stay queued, and the queue drains when it returns', async () => {
    await rig.stopSmtp()
    const created = await caseWithLeadAndLab()
    await sessions.lead
      .patch(`/api/cases/${created.id}`, {
        version: created.version,
        reviewerId: people.reviewer.id,
      })
      .expect(200)
    expect(await rig.sender.runOnce()).toEqual({ sent: 0, failed: 3 })
    const waiting = await outboxRows(db)
    expect(waiting.map((row) => [row.status, row.attempts])).toEqual([
      ['queued', 1],
      ['queued', 1],
      ['queued', 1],
    ])
    const tries = await db('outbox_attempts').select('outcome', 'error')
    expect(tries).toHaveLength(3)
    expect(
      tries.every(
        (entry: { outcome: string; error: string }) =>
          entry.outcome === 'failed' && entry.error.length > 0,
      ),
    ).toBe(true)

    await rig.restartSmtp()
    clock.advanceMinutes(1)
    expect(await rig.sender.runOnce()).toEqual({ sent: 3, failed: 0 })
    for (const key of ['lead', 'lab', 'reviewer'] as const) {
      const mail = await receivedBy(db, people[key].email)
      expect(mail, key).toHaveLength(1)
      const row = waiting.find((entry) => entry.toAddress === people[key].email)!
      expect(mail[0]!.parsed.messageId).toBe(row.messageId)
    }
    expect((await outboxRows(db)).every((row) => row.status === 'sent')).toBe(true)
  })

  it('retries after 1, 5 and 30 minutes, then hourly, and gives up a day after queueing', async () => {
    await rig.stopSmtp()
    await sessions.admin.post('/api/cases', newCase({ reviewerId: people.reviewer.id })).expect(201)
    const queuedAt = clock.now().getTime()
    const triedAt: number[] = []
    for (let minute = 0; minute <= 25 * 60; minute += 1) {
      const { failed } = await rig.sender.runOnce()
      if (failed > 0) triedAt.push(Math.round((clock.now().getTime() - queuedAt) / 60_000))
      clock.advanceMinutes(1)
    }
    // the default schedule: waits of 1, 5, 30 minutes, then 60, none planned past 24 h
    const expected = [0, 1, 6, 36]
    for (let at = 96; at <= 24 * 60; at += 60) expected.push(at)
    expect(triedAt).toEqual(expected)
    const [row] = await outboxRows(db)
    expect(row).toMatchObject({ status: 'failed', attempts: expected.length, nextAttemptAt: null })
    expect(await db('outbox_attempts').count({ n: '*' })).toEqual([{ n: expected.length }])
  })
})
