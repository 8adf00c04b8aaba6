import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import type { Role } from '../../shared/schemas/roles'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

const sessions = {} as Record<
  'admin' | 'investigator' | 'lab' | 'reviewer' | 'client' | 'client2',
  ApiSession
>
let orgA: number
let orgB: number
let investigator: TestPerson
let caseA: { id: number; number: string }
let caseB: { id: number; number: string }

beforeAll(async () => {
  await resetDatabase(db)
  orgA = await makeOrganisation(db, 'Alpha Castings')
  orgB = await makeOrganisation(db, 'Beta Forgings')
  const staff: [keyof typeof sessions, Role[]][] = [
    ['admin', ['admin']],
    ['investigator', ['investigator']],
    ['lab', ['lab']],
    ['reviewer', ['reviewer']],
  ]
  for (const [key, roles] of staff) {
    const person = await makePerson(db, roles)
    if (key === 'investigator') investigator = person
    sessions[key] = await signedIn(app, person.email, person.password)
  }
  const clientA = await makePerson(db, ['client'], { organisationId: orgA })
  const clientB = await makePerson(db, ['client'], { organisationId: orgB })
  sessions.client = await signedIn(app, clientA.email, clientA.password)
  sessions.client2 = await signedIn(app, clientB.email, clientB.password)
  caseA = await makeCase(db, orgA, investigator.id, {
    title: 'Snapped crane pin',
    material: '4140',
  })
  caseB = await makeCase(db, orgB, investigator.id, { title: 'Cracked valve body' })
})
afterAll(() => db.destroy())

const newCase = (organisationId: number) => ({
  title: 'Fractured drive shaft',
  organisationId,
  component: 'Drive shaft',
  material: 'EN 10083-3 42CrMo4',
  dueDate: '2027-01-15',
})

describe('GET /api/cases', () => {
  it('lists every organisation for staff', async () => {
    for (const role of ['admin', 'investigator', 'lab', 'reviewer'] as const) {
      const response = await sessions[role].get('/api/cases').expect(200)
      const ids = response.body.data.map((item: { id: number }) => item.id)
      expect(ids, role).toEqual(expect.arrayContaining([caseA.id, caseB.id]))
    }
  })

  it("shows a client only their own organisation's cases", async () => {
    const own = await sessions.client.get('/api/cases').expect(200)
    expect(own.body.data.map((item: { id: number }) => item.id)).toEqual([caseA.id])
    const other = await sessions.client2.get('/api/cases').expect(200)
    expect(other.body.data.map((item: { id: number }) => item.id)).toEqual([caseB.id])
    const sneaky = await sessions.client.get(`/api/cases?organisationId=${orgB}`).expect(200)
    expect(sneaky.body.data).toEqual([])
    expect(sneaky.body.page.total).toBe(0)
  })

  it('pages, filters by status and organisation, and searches', async () => {
    for (let index = 0; index < 5; index++) {
      await makeCase(db, orgB, investigator.id, { title: `Paging case ${index}` })
    }
    const first = await sessions.lab.get('/api/cases?page=1&pageSize=3&q=Paging').expect(200)
    expect(first.body.data).toHaveLength(3)
    expect(first.body.page).toEqual({ number: 1, size: 3, total: 5 })
    const second = await sessions.lab.get('/api/cases?page=2&pageSize=3&q=Paging').expect(200)
    expect(second.body.data).toHaveLength(2)
    expect(second.body.page).toEqual({ number: 2, size: 3, total: 5 })
    // past the end: no rows, and still the whole count
    const past = await sessions.lab.get('/api/cases?page=4&pageSize=3&q=Paging').expect(200)
    expect(past.body).toMatchObject({ data: [], page: { number: 4, size: 3, total: 5 } })
    const byOrg = await sessions.lab.get(`/api/cases?organisationId=${orgA}`).expect(200)
    expect(byOrg.body.data.map((item: { id: number }) => item.id)).toEqual([caseA.id])
    const byMaterial = await sessions.lab.get('/api/cases?q=4140').expect(200)
    expect(byMaterial.body.data.map((item: { id: number }) => item.id)).toEqual([caseA.id])
    const byNumber = await sessions.lab.get(`/api/cases?q=${caseB.number}`).expect(200)
    expect(byNumber.body.data[0].id).toBe(caseB.id)
    const byStatus = await sessions.lab.get('/api/cases?status=closed').expect(200)
    expect(byStatus.body.data).toEqual([])
  })

  it('treats % and _ in the search as plain characters', async () => {
    const response = await sessions.lab.get('/api/cases?q=%25').expect(200)
    expect(response.body.data).toEqual([])
  })

  it('answers a bad query with 400', async () => {
    await sessions.lab.get('/api/cases?pageSize=1000').expect(400)
    await sessions.lab.get('/api/cases?status=lost').expect(400)
    await sessions.lab.get('/api/cases?colour=red').expect(400)
  })
})

describe('GET /api/cases/:id', () => {
  it('opens a case for staff and for its own client', async () => {
    const staff = await sessions.reviewer.get(`/api/cases/${caseB.id}`).expect(200)
    expect(staff.body.data).toMatchObject({ id: caseB.id, organisationName: 'Beta Forgings' })
    await sessions.client.get(`/api/cases/${caseA.id}`).expect(200)
  })

  it("answers 404 for another organisation's case, exactly as for a missing one", async () => {
    const hidden = await sessions.client.get(`/api/cases/${caseB.id}`).expect(404)
    const missing = await sessions.client.get('/api/cases/999999').expect(404)
    expect(hidden.body).toEqual(missing.body)
  })

  it('answers 400 for an id that is not a number', async () => {
    await sessions.lab.get('/api/cases/abc').expect(400)
  })
})

describe('POST /api/cases', () => {
  it('lets admins and investigators open a case with the next number of the year', async () => {
    const year = new Date().getUTCFullYear()
    const first = await sessions.investigator.post('/api/cases', newCase(orgA)).expect(201)
    const second = await sessions.admin.post('/api/cases', newCase(orgB)).expect(201)
    expect(first.body.data.number).toMatch(new RegExp(`^FL-${year}-\\d{4}$`))
    const sequence = (number: string) => Number(number.slice(-4))
    expect(sequence(second.body.data.number)).toBe(sequence(first.body.data.number) + 1)
    expect(first.body.data).toMatchObject({ status: 'intake', dueDate: '2027-01-15' })
    const audit = await db('audit_events').where({ caseId: first.body.data.id })
    expect(audit.map((entry: { action: string }) => entry.action)).toEqual(['case.created'])
  })

  it('gives concurrent new cases distinct numbers', async () => {
    const created = await Promise.all(
      Array.from({ length: 6 }, () => sessions.investigator.post('/api/cases', newCase(orgA))),
    )
    const numbers = created.map((response) => response.body.data.number)
    expect(new Set(numbers).size).toBe(6)
  })

  it("keeps the whole list's total true at once when a case is opened or moves organisation", async () => {
    const totalOf = async (who: 'lab' | 'client' | 'client2') =>
      (await sessions[who].get('/api/cases').expect(200)).body.page.total as number
    const [staff, clientA, clientB] = [
      await totalOf('lab'),
      await totalOf('client'),
      await totalOf('client2'),
    ]
    const opened = await sessions.admin.post('/api/cases', newCase(orgA)).expect(201)
    expect(await totalOf('lab')).toBe(staff + 1)
    expect(await totalOf('client')).toBe(clientA + 1)
    await sessions.admin
      .patch(`/api/cases/${opened.body.data.id}`, {
        organisationId: orgB,
        version: opened.body.data.version,
      })
      .expect(200)
    expect(await totalOf('lab')).toBe(staff + 1)
    expect(await totalOf('client')).toBe(clientA)
    expect(await totalOf('client2')).toBe(clientB + 1)
  })

  it('refuses everyone else with 403 and writes nothing', async () => {
    const before = await db('cases').count({ count: '*' })
    for (const role of ['lab', 'reviewer', 'client', 'client2'] as const) {
      const response = await sessions[role].post('/api/cases', newCase(orgA))
      expect(response.status, role).toBe(403)
    }
    expect(await db('cases').count({ count: '*' })).toEqual(before)
  })

  it('answers bad input with 400 naming the field, and writes nothing', async () => {
    const before = await db('cases').count({ count: '*' })
    const missing = await sessions.investigator.post('/api/cases', { title: 'No org' })
    expect(missing.status).toBe(400)
    expect(missing.body.error.details.map((item: { path: string }) => item.path)).toContain(
      'organisationId',
    )
    const wrongType = await sessions.investigator.post('/api/cases', { ...newCase(orgA), title: 5 })
    expect(wrongType.status).toBe(400)
    const extra = await sessions.investigator.post('/api/cases', {
      ...newCase(orgA),
      status: 'closed',
    })
    expect(extra.status).toBe(400)
    const badDate = await sessions.investigator.post('/api/cases', {
      ...newCase(orgA),
      dueDate: '15/01/2027',
    })
    expect(badDate.status).toBe(400)
    const noOrg = await sessions.investigator.post('/api/cases', newCase(987654))
    expect(noOrg.status).toBe(400)
    const notInvestigator = await sessions.investigator.post('/api/cases', {
      ...newCase(orgA),
      leadInvestigatorId: (await makePerson(db, ['lab'])).id,
    })
    expect(notInvestigator.status).toBe(400)
    expect(await db('cases').count({ count: '*' })).toEqual(before)
  })
})

describe('POST /api/cases/:id/status', () => {
  it('moves a case along the state table and records it', async () => {
    const created = await makeCase(db, orgA, investigator.id)
    const moved = await sessions.investigator
      .post(`/api/cases/${created.id}/status`, { status: 'examination' })
      .expect(200)
    expect(moved.body.data.status).toBe('examination')
    expect(moved.body.data.allowedNextStates).toEqual(['drafting'])
    const audit = await db('audit_events').where({
      caseId: created.id,
      action: 'case.status_changed',
    })
    expect(audit).toHaveLength(1)
  })

  it('refuses a jump the table does not allow with 409', async () => {
    const created = await makeCase(db, orgA, investigator.id)
    const response = await sessions.investigator.post(`/api/cases/${created.id}/status`, {
      status: 'issued',
    })
    expect(response.status).toBe(409)
    expect(response.body.error.code).toBe('invalid_transition')
  })

  it('keeps review and release transitions to their own actions', async () => {
    const created = await makeCase(db, orgA, investigator.id)
    await db('cases').where({ id: created.id }).update({ status: 'drafting' })
    const response = await sessions.investigator.post(`/api/cases/${created.id}/status`, {
      status: 'in_review',
    })
    expect(response.status).toBe(409)
  })

  it('refuses lab, reviewer and clients', async () => {
    const created = await makeCase(db, orgA, investigator.id)
    await sessions.lab
      .post(`/api/cases/${created.id}/status`, { status: 'examination' })
      .expect(403)
    await sessions.reviewer
      .post(`/api/cases/${created.id}/status`, { status: 'examination' })
      .expect(403)
    await sessions.client
      .post(`/api/cases/${created.id}/status`, { status: 'examination' })
      .expect(403)
    await sessions.client2
      .post(`/api/cases/${created.id}/status`, { status: 'examination' })
      .expect(404)
    const unchanged = await db('cases').where({ id: created.id }).first('status')
    expect(unchanged.status).toBe('intake')
  })
})
