import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
const today = new Date()
const day = (offset: number) =>
  new Date(today.getTime() + offset * 86_400_000).toISOString().slice(0, 10)

type Key = 'admin' | 'lead' | 'co' | 'lab' | 'reviewer' | 'client' | 'client2'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
const ids = {} as Record<'late' | 'soon' | 'review' | 'issued' | 'other', number>

beforeAll(async () => {
  await resetDatabase(db)
  const own = await makeOrganisation(db)
  const other = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    co: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: own },
    client2: { roles: ['client'], organisationId: other },
  })
  sessions = await signInAll(app, people)
  const team = {
    leadInvestigatorId: people.lead.id,
    labTechnicianId: people.lab.id,
    reviewerId: people.reviewer.id,
  }
  const make = (overrides: object, organisation = own) =>
    makeCase(db, organisation, people.admin.id, { ...team, ...overrides })
  ids.late = (await make({ failureDate: day(-40), receivedOn: day(-30), dueDate: day(-2) })).id
  ids.soon = (await make({ dueDate: day(3), coInvestigatorIds: [people.co.id] })).id
  ids.review = (await make({ dueDate: day(20) })).id
  ids.issued = (await make({ mechanisms: [{ mechanism: 'creep', primary: true }] })).id
  ids.other = (await make({ dueDate: day(-1) }, other)).id
  await db('cases').where({ id: ids.review }).update({ status: 'in_review' })
  await db('cases').where({ id: ids.issued }).update({ status: 'issued' })
})
afterAll(() => db.destroy())

async function listsOf(key: Key): Promise<Record<string, number[]>> {
  const response = await sessions[key].get('/api/dashboard').expect(200)
  return Object.fromEntries(
    response.body.data.lists.map((list: { key: string; cases: { id: number }[] }) => [
      list.key,
      list.cases.map((item) => item.id),
    ]),
  )
}

describe('GET /api/dashboard', () => {
  it('shows an investigator their open cases, what is overdue and what is due this week', async () => {
    const lists = await listsOf('lead')
    expect(lists.myOpen).toEqual(expect.arrayContaining([ids.late, ids.soon, ids.review]))
    expect(lists.myOpen).not.toContain(ids.issued)
    expect(lists.overdue).toEqual([ids.late, ids.other]) // by due date, oldest first
    expect(lists.dueThisWeek).toEqual([ids.soon])
    expect(lists.recentlyIssued).toEqual([ids.issued])
    expect(lists.awaitingMyReview).toBeUndefined()
    const co = await listsOf('co')
    expect(co.myOpen).toEqual([ids.soon])
  })

  it('shows a reviewer what waits for review, the lab what waits for the lab', async () => {
    expect((await listsOf('reviewer')).awaitingMyReview).toEqual([ids.review])
    const lab = await listsOf('lab')
    expect(lab.awaitingLab).toEqual(expect.arrayContaining([ids.late, ids.soon]))
    expect(lab.awaitingLab).not.toContain(ids.review)
  })

  it('shows administrators every overdue case, and counts by state and mechanism', async () => {
    const response = await sessions.admin.get('/api/dashboard').expect(200)
    const overdue = response.body.data.lists.find((list: { key: string }) => list.key === 'overdue')
    expect(overdue.cases.map((item: { id: number }) => item.id).sort()).toEqual(
      [ids.late, ids.other].sort(),
    )
    expect(response.body.data.byState).toEqual(
      expect.arrayContaining([
        { state: 'in_review', count: 1 },
        { state: 'issued', count: 1 },
      ]),
    )
    expect(response.body.data.byMechanism).toEqual([{ mechanism: 'creep', count: 1 }])
  })

  it('shows a client only their organisation, as status lines, without internal counts', async () => {
    const response = await sessions.client2.get('/api/dashboard').expect(200)
    const lists = response.body.data.lists
    expect(lists.map((list: { key: string }) => list.key)).toEqual(['ourOpen', 'recentlyIssued'])
    expect(lists[0].cases).toEqual([expect.objectContaining({ id: ids.other, stage: 'received' })])
    expect(Object.keys(lists[0].cases[0]).sort()).toEqual(
      ['clientReference', 'component', 'id', 'number', 'stage', 'title'].sort(),
    )
    expect(response.body.data.byState).toEqual([])
    expect((await listsOf('client')).recentlyIssued).toEqual([ids.issued])
  })
})
