import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const { app, cleanup } = appWithUploads(db)

type Key = 'admin' | 'lead' | 'reviewer' | 'client'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let caseNumber: string

const at = (path: string) => `/api/cases/${caseId}${path}`
const paragraph = (text: string) => ({ type: 'paragraph', content: [{ type: 'text', text }] })
const draft = (text: string) => ({
  type: 'doc',
  content: [
    {
      type: 'heading',
      attrs: { level: 2, section: 'summary' },
      content: [{ type: 'text', text: 'Summary' }],
    },
    paragraph(text),
  ],
})

async function saveDraft(text: string) {
  const version = (await sessions.lead.get(at('/findings')).expect(200)).body.data.version
  await sessions.lead.put(at('/findings'), { doc: draft(text), version }).expect(200)
}

/** The messages queued since `after`, as (kind, to, subject). */
async function queuedAfter(after: number) {
  return (await db('outbox_messages')
    .where('id', '>', after)
    .orderBy('id')
    .select('kind', 'toAddress', 'subject', 'payload')) as {
    kind: string
    toAddress: string
    subject: string
    payload: string
  }[]
}
const lastId = async () =>
  Number(((await db('outbox_messages').max({ id: 'id' })) as [{ id: number | null }])[0].id ?? 0)

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
  })
  sessions = await signInAll(app, people)
  const created = await makeCase(db, org, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    reviewerId: people.reviewer.id,
  })
  caseId = created.id
  caseNumber = created.number
  await db('cases').where({ id: caseId }).update({ status: 'drafting' })
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

describe('e-mail notices of review, issue and questions (queued with the action)', () => {
  it('tells the reviewer of a submission and the lead of revisions, with the reason', async () => {
    await saveDraft('First draft.')
    let before = await lastId()
    await sessions.lead.post(at('/review/submit')).expect(200)
    let queued = await queuedAfter(before)
    expect(queued.map((m) => [m.kind, m.toAddress])).toEqual([
      ['review_requested', people.reviewer.email],
    ])
    expect(queued[0]!.subject.startsWith(caseNumber)).toBe(true)

    before = await lastId()
    const reason = 'Say which thread the origin is at.'
    await sessions.reviewer.post(at('/review/request-revisions'), { reason }).expect(200)
    queued = await queuedAfter(before)
    expect(queued.map((m) => [m.kind, m.toAddress])).toEqual([
      ['revisions_requested', people.lead.email],
    ])
    expect(JSON.parse(queued[0]!.payload).facts.reason).toBe(reason)
  })

  it('tells the lead of approval and the client of the issued report', async () => {
    await saveDraft('Second draft: origin at the first engaged thread.')
    await sessions.lead.post(at('/review/submit')).expect(200)
    let before = await lastId()
    await sessions.reviewer.post(at('/review/approve')).expect(200)
    expect((await queuedAfter(before)).map((m) => [m.kind, m.toAddress])).toEqual([
      ['approved', people.lead.email],
    ])
    before = await lastId()
    await sessions.lead.post(at('/issue')).expect(201)
    const issued = await queuedAfter(before)
    expect(issued.map((m) => [m.kind, m.toAddress])).toEqual([
      ['report_issued', people.client.email],
    ])
    expect(issued[0]!.subject.startsWith(`${caseNumber}-R`)).toBe(true)
  })

  it('tells the lead of a client’s question and the client of the answer, quoting them', async () => {
    const reports = await sessions.client.get(at('/reports')).expect(200)
    const reportId = reports.body.data[0].id as number
    let before = await lastId()
    const question = 'Was the bolt preload checked?'
    const asked = await sessions.client
      .post(`/api/reports/${reportId}/questions`, { body: question })
      .expect(201)
    let queued = await queuedAfter(before)
    expect(queued.map((m) => [m.kind, m.toAddress])).toEqual([
      ['client_question', people.lead.email],
    ])
    expect(JSON.parse(queued[0]!.payload).facts.question).toBe(question)

    before = await lastId()
    const answer = 'Yes: the torque record is in the service history.'
    await sessions.lead
      .post(`/api/reports/${reportId}/questions/${asked.body.data.id}/answers`, { body: answer })
      .expect(201)
    queued = await queuedAfter(before)
    expect(queued.map((m) => [m.kind, m.toAddress])).toEqual([['answer', people.client.email]])
    expect(JSON.parse(queued[0]!.payload).facts.answer).toBe(answer)
  })
})
