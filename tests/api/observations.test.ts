import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeCase, makeOrganisation, makePeople, makePerson, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'lead' | 'lab' | 'reviewer' | 'client'
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
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
  })
  sessions = await signInAll(app, people)
  const options = { leadInvestigatorId: people.lead.id, labTechnicianId: people.lab.id }
  caseId = (await makeCase(db, org, admin.id, options)).id
  otherCaseId = (await makeCase(db, org, admin.id, options)).id
})
afterAll(() => db.destroy())

const observations = (id = caseId) => `/api/cases/${id}/observations`

describe('the observations register', () => {
  it('numbers ten concurrent observations O-1 … O-10, each number once', async () => {
    const responses = await Promise.all(
      Array.from({ length: 10 }, (_, index) =>
        sessions.lead.post(observations(), { text: `Beach marks visible, photo area ${index}` }),
      ),
    )
    for (const response of responses)
      expect(response.status, JSON.stringify(response.body)).toBe(201)
    const numbers = responses
      .map((r) => r.body.data.number as string)
      .sort((a, b) => Number(a.slice(2)) - Number(b.slice(2)))
    expect(numbers).toEqual(Array.from({ length: 10 }, (_, i) => `O-${i + 1}`))
    // another case counts on its own
    const other = await sessions.lead.post(observations(otherCaseId), {
      text: 'Shear lip on one side',
    })
    expect(other.body.data.number).toBe('O-1')
  })

  it('withdraws with a reason, keeps the observation and never reuses its number', async () => {
    const created = await sessions.lab
      .post(observations(), { text: 'Ratchet marks at the thread root' })
      .expect(201)
    const { id, number } = created.body.data
    const withdraw = `${observations()}/${id}/withdraw`
    await sessions.lead.post(withdraw, { reason: '' }).expect(400)
    const withdrawn = await sessions.lead
      .post(withdraw, { reason: 'Marks were from handling' })
      .expect(200)
    expect(withdrawn.body.data).toMatchObject({
      number,
      withdrawn: true,
      withdrawReason: 'Marks were from handling',
    })
    await sessions.lead.post(withdraw, { reason: 'again' }).expect(409)
    const next = await sessions.lead
      .post(observations(), { text: 'Chevrons point to the origin' })
      .expect(201)
    expect(Number(next.body.data.number.slice(2))).toBe(Number(number.slice(2)) + 1)
    const list = await sessions.reviewer.get(observations()).expect(200)
    expect(list.body.data.find((o: { id: number }) => o.id === id).withdrawn).toBe(true)
    expect((await sessions.lead.delete(`${observations()}/${id}`)).status).toBe(404)
  })

  it('links the case’s own items and refuses another case’s items and unknown photos', async () => {
    const [sampleId] = (await db('samples').insert({
      caseId,
      position: 90,
      itemId: 'X-S90',
      description: 'x',
      receivedFrom: 'y',
      receivedOn: '2026-11-01',
      createdBy: people.lead.id,
    })) as number[]
    const [foreignId] = (await db('samples').insert({
      caseId: otherCaseId,
      position: 90,
      itemId: 'Y-S90',
      description: 'x',
      receivedFrom: 'y',
      receivedOn: '2026-11-01',
      createdBy: people.lead.id,
    })) as number[]
    const linked = await sessions.lead
      .post(observations(), { text: 'Dimples in the final overload zone', sampleIds: [sampleId] })
      .expect(201)
    expect(linked.body.data.sampleIds).toEqual([sampleId])
    const before = await db('observations').where({ caseId }).max({ n: 'number' }).first()
    const foreign = await sessions.lead.post(observations(), { text: 'x', sampleIds: [foreignId] })
    expect(foreign.status).toBe(400)
    expect(foreign.body.error.details[0].path).toBe('sampleIds')
    const photo = await sessions.lead.post(observations(), { text: 'x', photoIds: [999999] })
    expect(photo.status).toBe(400)
    expect(photo.body.error.details[0].path).toBe('photoIds')
    // a refusal uses up no number
    expect(await db('observations').where({ caseId }).max({ n: 'number' }).first()).toEqual(before)
  })

  it('is for staff: a client cannot read it, a reviewer cannot write it', async () => {
    await sessions.client.get(observations()).expect(403)
    await sessions.client.post(observations(), { text: 'x' }).expect(403)
    await sessions.reviewer.post(observations(), { text: 'x' }).expect(403)
  })
})
