import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeCase, makeOrganisation, makePeople, makePerson, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'lead' | 'lab' | 'otherLab' | 'reviewer' | 'client'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let otherCaseId: number

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  const admin = await makePerson(db, ['admin'])
  people = await makePeople(db, {
    lead: ['investigator'],
    lab: ['lab'],
    otherLab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
  })
  sessions = await signInAll(app, people)
  const parts = { leadInvestigatorId: people.lead.id, labTechnicianId: people.lab.id }
  caseId = (await makeCase(db, org, admin.id, parts)).id
  otherCaseId = (await makeCase(db, org, admin.id, parts)).id
})
afterAll(() => db.destroy())

const hardness = (id = caseId) => `/api/cases/${id}/hardness`

describe('hardness readings', () => {
  it('records a set with its mean, conversions (named tables) and an activity entry', async () => {
    const created = await sessions.lab
      .post(hardness(), { scale: 'HRC', values: [29.5, 30, 30.5], location: 'Shank, mid-radius' })
      .expect(201)
    // ASTM E140 Table 1, typed from memory: 30 HRC ≈ 302 HV ≈ 286 HBW
    expect(created.body.data).toMatchObject({
      scale: 'HRC',
      values: [29.5, 30, 30.5],
      mean: 30,
      conversion: { HRC: 30, HV: 302, HBW: 286 },
    })
    expect(created.body.data.conversion.sources[0]).toMatch(/ASTM E140/)
    const list = await sessions.reviewer.get(hardness()).expect(200)
    expect(list.body.data).toHaveLength(1)
    const activity = await db('audit_events').where({ caseId, action: 'hardness.recorded' })
    expect(activity).toHaveLength(1)
  })

  it('lets only the case’s lab technician, lead and administrators record', async () => {
    const body = { scale: 'HV', values: [250], load: 'HV10' }
    await sessions.lead.post(hardness(), body).expect(201)
    expect((await sessions.otherLab.post(hardness(), body)).status).toBe(403)
    expect((await sessions.reviewer.post(hardness(), body)).status).toBe(403)
    // clients see neither the readings nor that there are any
    expect((await sessions.client.get(hardness())).status).toBe(404)
    expect((await sessions.client.post(hardness(), body)).status).toBe(404)
  })

  it('refuses bad readings and a specimen of another case, storing nothing', async () => {
    const before = await db('hardness_sets').count({ n: '*' })
    const specimen = await sessions.lab
      .post(`/api/cases/${otherCaseId}/specimens`, { label: 'T1' })
      .expect(201)
    const refused = [
      { scale: 'HRZ', values: [30] },
      { scale: 'HRC', values: [] },
      { scale: 'HRC', values: [-3] },
      { scale: 'HRC', values: ['30'] },
      { scale: 'HRC', values: [30], specimenId: specimen.body.data.id },
    ]
    for (const body of refused) {
      const response = await sessions.lab.post(hardness(), body)
      expect(response.status, JSON.stringify(body)).toBe(400)
      expect(response.body.error.code).toBe('validation_failed')
    }
    expect(await db('hardness_sets').count({ n: '*' })).toEqual(before)
  })
})
