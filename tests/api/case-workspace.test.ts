import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { createCaseService } from '../../server/services/cases'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'admin' | 'lead' | 'other' | 'lab' | 'reviewer' | 'client' | 'client2'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let orgA: number
let orgB: number

beforeAll(async () => {
  await resetDatabase(db)
  orgA = await makeOrganisation(db, 'Alder Hoists')
  orgB = await makeOrganisation(db, 'Birch Valves')
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    other: ['investigator', 'reviewer'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: orgA },
    client2: { roles: ['client'], organisationId: orgB },
  })
  sessions = await signInAll(app, people)
})
afterAll(() => db.destroy())

/** A case of organisation A led by `people.lead`. */
const ledCase = (overrides = {}) =>
  makeCase(db, orgA, people.admin.id, { leadInvestigatorId: people.lead.id, ...overrides })

async function snapshot(caseId: number) {
  const row = await db('cases').where({ id: caseId }).first()
  const activity = await db('audit_events').where({ caseId }).count({ count: '*' })
  const members = await db('case_co_investigators').where({ caseId }).select('userId')
  return { row, activity, members }
}

describe('PATCH /api/cases/:id', () => {
  it('lets the lead edit any subset, bumps the version and records one activity row', async () => {
    const created = await ledCase({ receivedOn: '2026-03-02' })
    const response = await sessions.lead
      .patch(`/api/cases/${created.id}`, {
        version: 1,
        clientReference: '  PO-77  ',
        heatOrLot: 'H 4417',
        safetyCritical: true,
        turnaround: 'rush',
      })
      .expect(200)
    expect(response.body.data).toMatchObject({
      clientReference: 'PO-77',
      heatOrLot: 'H 4417',
      safetyCritical: true,
      turnaround: 'rush',
      version: 2,
      receivedOn: '2026-03-02',
    })
    const activity = await db('audit_events').where({ caseId: created.id, action: 'case.updated' })
    expect(activity).toHaveLength(1)
    const stored = activity[0].details
    const details = typeof stored === 'string' ? JSON.parse(stored) : stored
    expect(details.changes).toEqual({
      clientReference: { from: null, to: 'PO-77' },
      heatOrLot: { from: null, to: 'H 4417' },
      safetyCritical: { from: false, to: true },
      turnaround: { from: 'standard', to: 'rush' },
    })
  })

  it('writes nothing and records nothing when nothing differs', async () => {
    const created = await ledCase()
    const before = await snapshot(created.id)
    const same = await sessions.lead
      .patch(`/api/cases/${created.id}`, { version: 1, title: created.title })
      .expect(200)
    expect(same.body.data.version).toBe(1)
    expect(await snapshot(created.id)).toEqual(before)
  })

  it('answers a stale version with 409 version_conflict and the current record, writing nothing', async () => {
    const created = await ledCase()
    await sessions.lead
      .patch(`/api/cases/${created.id}`, { version: 1, title: 'First' })
      .expect(200)
    const before = await snapshot(created.id)
    const stale = await sessions.admin.patch(`/api/cases/${created.id}`, {
      version: 1,
      title: 'Second',
    })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('version_conflict')
    expect(stale.body.error.details.current).toMatchObject({ title: 'First', version: 2 })
    expect(await snapshot(created.id)).toEqual(before)
  })

  it('refuses people who do not keep the case, and hides other organisations’ cases', async () => {
    const created = await ledCase()
    const before = await snapshot(created.id)
    const change = { version: 1, title: 'Changed by someone else' }
    for (const key of ['other', 'lab', 'reviewer', 'client'] as const) {
      const response = await sessions[key].patch(`/api/cases/${created.id}`, change)
      expect(response.status, key).toBe(403)
    }
    const hidden = await sessions.client2.patch(`/api/cases/${created.id}`, change)
    expect(hidden.status).toBe(404)
    expect(await snapshot(created.id)).toEqual(before)
  })

  it('refuses a reviewer who works on the case with 409 reviewer_is_lead', async () => {
    const created = await ledCase({ coInvestigatorIds: [people.other.id] })
    const before = await snapshot(created.id)
    const asLead = await sessions.lead.patch(`/api/cases/${created.id}`, {
      version: 1,
      reviewerId: people.lead.id,
    })
    expect(asLead.status).toBe(409)
    expect(asLead.body.error.code).toBe('reviewer_is_lead')
    const asCo = await sessions.lead.patch(`/api/cases/${created.id}`, {
      version: 1,
      reviewerId: people.other.id,
    })
    expect(asCo.body.error.code).toBe('reviewer_is_lead')
    const leadBecomesReviewer = await sessions.admin.patch(`/api/cases/${created.id}`, {
      version: 1,
      reviewerId: people.reviewer.id,
      leadInvestigatorId: null,
      coInvestigatorIds: [people.reviewer.id],
    })
    expect(leadBecomesReviewer.status).toBe(409)
    expect(await snapshot(created.id)).toEqual(before)
  })

  it('assigns people who hold the part’s role, as one assignment in the activity', async () => {
    const created = await ledCase()
    const response = await sessions.lead
      .patch(`/api/cases/${created.id}`, {
        version: 1,
        coInvestigatorIds: [people.other.id],
        labTechnicianId: people.lab.id,
        reviewerId: people.reviewer.id,
      })
      .expect(200)
    expect(response.body.data.coInvestigatorIds).toEqual([people.other.id])
    expect(response.body.data.people.map((person: { id: number }) => person.id).sort()).toEqual(
      [people.lead.id, people.other.id, people.lab.id, people.reviewer.id].sort(),
    )
    const kinds = await db('audit_events')
      .where({ caseId: created.id })
      .orderBy('id')
      .pluck('action')
    expect(kinds).toEqual(['case.created', 'case.assigned'])
    const wrongRole = await sessions.lead.patch(`/api/cases/${created.id}`, {
      version: 2,
      labTechnicianId: people.reviewer.id,
    })
    expect(wrongRole.status).toBe(400)
    expect(wrongRole.body.error.details).toEqual([
      { path: 'labTechnicianId', message: 'Choose an active lab technician.' },
    ])
  })

  it('classifies the failure with exactly one primary mechanism', async () => {
    const created = await ledCase()
    const twoPrimaries = await sessions.lead.patch(`/api/cases/${created.id}`, {
      version: 1,
      mechanisms: [
        { mechanism: 'fatigue_high_cycle', primary: true },
        { mechanism: 'fatigue_fretting', primary: true },
      ],
    })
    expect(twoPrimaries.status).toBe(400)
    const response = await sessions.lead
      .patch(`/api/cases/${created.id}`, {
        version: 1,
        mechanisms: [
          { mechanism: 'fatigue_high_cycle', primary: true },
          { mechanism: 'fatigue_fretting', primary: false },
        ],
        rootCause: 'maintenance',
      })
      .expect(200)
    expect(response.body.data.mechanisms).toHaveLength(2)
    const kinds = await db('audit_events')
      .where({ caseId: created.id })
      .orderBy('id')
      .pluck('action')
    expect(kinds).toEqual(['case.created', 'case.classified'])
  })

  it('keeps the date rules: failure not in the future nor after receipt, due not before receipt', async () => {
    const created = await ledCase({ receivedOn: '2026-05-10' })
    const before = await snapshot(created.id)
    const refusals: [object, string][] = [
      [{ failureDate: '2026-05-11' }, 'failureDate'],
      [{ failureDate: '2999-01-01', receivedOn: null }, 'failureDate'],
      [{ dueDate: '2026-05-09' }, 'dueDate'],
      [{ failureDate: '0050-06-15' }, 'failureDate'],
      [{ dueDate: '2026-02-30' }, 'dueDate'],
    ]
    for (const [change, field] of refusals) {
      const response = await sessions.lead.patch(`/api/cases/${created.id}`, {
        version: 1,
        ...change,
      })
      expect(response.status, JSON.stringify(change)).toBe(400)
      expect(response.body.error.details[0].path, JSON.stringify(change)).toBe(field)
    }
    expect(await snapshot(created.id)).toEqual(before)
    const old = await sessions.lead
      .patch(`/api/cases/${created.id}`, { version: 1, failureDate: '1851-06-15' })
      .expect(200)
    expect(old.body.data.failureDate).toBe('1851-06-15')
  })

  it('reads ids strictly in the address and the body', async () => {
    const created = await ledCase()
    for (const id of [`${created.id}%20`, '1e3', '0x10', '-1', '01']) {
      const response = await sessions.lead.get(`/api/cases/${id}`)
      expect(response.status, id).toBe(400)
    }
    for (const reviewerId of [true, [people.reviewer.id], `0x${people.reviewer.id}`]) {
      const response = await sessions.lead.patch(`/api/cases/${created.id}`, {
        version: 1,
        reviewerId,
      })
      expect(response.status, JSON.stringify(reviewerId)).toBe(400)
      expect(response.body.error.details[0].path).toBe('reviewerId')
    }
  })

  it('commits a change and its activity row together or not at all', async () => {
    const created = await ledCase()
    const before = await snapshot(created.id)
    const cases = createCaseService()
    const actor = { id: people.lead.id, roles: ['investigator' as const], organisationId: null }
    await expect(
      db.transaction(async (trx) => {
        await cases.update({ actor, db: trx }, created.id, { version: 1, title: 'Rolled back' })
        throw new Error('a later step of the same action failed')
      }),
    ).rejects.toThrow('a later step')
    expect(await snapshot(created.id)).toEqual(before)
  })
})

describe('POST /api/cases with the whole record', () => {
  it('opens a case with people, classification and parties, checking them as an edit does', async () => {
    const body = {
      title: 'Cracked trunnion',
      organisationId: orgA,
      component: 'Trunnion',
      material: 'EN 10083-3 34CrNiMo6',
      leadInvestigatorId: people.lead.id,
      reviewerId: people.lead.id,
    }
    const refused = await sessions.admin.post('/api/cases', body)
    expect(refused.body.error.code).toBe('reviewer_is_lead')
    const created = await sessions.admin
      .post('/api/cases', {
        ...body,
        reviewerId: people.reviewer.id,
        interestedParties: [
          { name: 'A. Owner', organisation: null, email: 'owner@example.test', role: 'owner' },
        ],
      })
      .expect(201)
    expect(created.body.data).toMatchObject({ reviewerId: people.reviewer.id, version: 1 })
    expect(created.body.data.interestedParties).toHaveLength(1)
  })
})

describe('what a client sees', () => {
  it('answers a client with the plain status line only, in client words', async () => {
    const created = await ledCase({ clientReference: 'AH-19' })
    await db('cases').where({ id: created.id }).update({ status: 'revisions_requested' })
    const response = await sessions.client.get(`/api/cases/${created.id}`).expect(200)
    expect(response.body.data).toEqual({
      id: created.id,
      number: created.number,
      title: created.title,
      component: 'Test component',
      clientReference: 'AH-19',
      stage: 'report_in_preparation',
    })
    const list = await sessions.client.get('/api/cases?stage=report_in_preparation').expect(200)
    expect(list.body.data.map((item: { id: number }) => item.id)).toContain(created.id)
    for (const item of list.body.data) {
      expect(Object.keys(item).sort()).toEqual(
        ['clientReference', 'component', 'id', 'number', 'stage', 'title'].sort(),
      )
    }
  })

  it('keeps the activity from clients, and another organisation’s from guessing', async () => {
    const created = await ledCase()
    await sessions.client.get(`/api/cases/${created.id}/activity`).expect(403)
    const guessed = await sessions.client2.get(`/api/cases/${created.id}/activity`).expect(404)
    const missing = await sessions.client2.get('/api/cases/999999/activity').expect(404)
    expect(guessed.body).toEqual(missing.body)
  })
})

describe('GET /api/cases/:id/activity', () => {
  it('pages the trail newest first and filters by person and kind', async () => {
    const created = await ledCase()
    await sessions.lead.patch(`/api/cases/${created.id}`, { version: 1, title: 'One' }).expect(200)
    await sessions.admin.patch(`/api/cases/${created.id}`, { version: 2, title: 'Two' }).expect(200)
    await sessions.lead
      .post(`/api/cases/${created.id}/status`, { status: 'examination' })
      .expect(200)
    const all = await sessions.lab.get(`/api/cases/${created.id}/activity`).expect(200)
    expect(all.body.data.map((entry: { kind: string }) => entry.kind)).toEqual([
      'case.status_changed',
      'case.updated',
      'case.updated',
      'case.created',
    ])
    expect(all.body.page).toEqual({ number: 1, size: 25, total: 4 })
    const byLead = await sessions.lab
      .get(`/api/cases/${created.id}/activity?actorId=${people.lead.id}`)
      .expect(200)
    expect(byLead.body.data).toHaveLength(2)
    expect(byLead.body.data[1].details.changes.title).toEqual({ from: created.title, to: 'One' })
    const edits = await sessions.lab
      .get(`/api/cases/${created.id}/activity?kind=case.updated&pageSize=1&page=2`)
      .expect(200)
    expect(edits.body.data[0].actorId).toBe(people.lead.id)
    expect(edits.body.page.total).toBe(2)
    await sessions.lab.get(`/api/cases/${created.id}/activity?kind=case.deleted`).expect(400)
  })

  it('outlives what it describes: the database refuses to delete a case with activity', async () => {
    const created = await ledCase()
    await expect(db('cases').where({ id: created.id }).delete()).rejects.toThrow(/foreign key/i)
  })
})

describe('GET /api/staff', () => {
  it('lists active staff with their roles for choosing people, and no clients', async () => {
    const response = await sessions.lead.get('/api/staff').expect(200)
    const ids = response.body.data.map((member: { id: number }) => member.id)
    expect(ids).toEqual(expect.arrayContaining([people.lead.id, people.lab.id]))
    expect(ids).not.toContain(people.client.id)
  })
})
