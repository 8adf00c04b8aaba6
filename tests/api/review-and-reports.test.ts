import { createHash } from 'node:crypto'
import { readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { CaseState } from '../../shared/workflow/case-states'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { plainJpeg } from '../factories/images'
import { uploadPhoto } from '../factories/photos'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const { app, uploads, cleanup } = appWithUploads(db)

type Key =
  | 'admin'
  | 'lead'
  | 'co'
  | 'lab'
  | 'reviewer'
  | 'otherReviewer'
  | 'both'
  | 'secondLead'
  | 'client'
  | 'otherClient'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let caseNumber: string
let photoId: number

const sha256 = (bytes: Buffer | string) => createHash('sha256').update(bytes).digest('hex')
const paragraph = (text: string) => ({ type: 'paragraph', content: [{ type: 'text', text }] })
const heading = (section: string, text: string) => ({
  type: 'heading',
  attrs: { level: 2, section },
  content: [{ type: 'text', text }],
})
const draft = (...extra: object[]) => ({
  type: 'doc',
  content: [
    heading('summary', 'Summary'),
    paragraph('The pin failed by fatigue from a thread root.'),
    { type: 'figure', attrs: { figureId: 'f1', photoId, caption: 'Fracture face' } },
    { type: 'liveBlock', attrs: { kind: 'service_history' } },
    heading('conclusions', 'Conclusions'),
    ...extra,
  ],
})

const at = (path: string, id = caseId) => `/api/cases/${id}${path}`
const statusOf = async (id = caseId) =>
  ((await db('cases').where({ id }).first('status')) as { status: CaseState }).status
async function saveDraft(session: ApiSession, doc: object, id = caseId) {
  const version = (await session.get(at('/findings', id)).expect(200)).body.data.version as number
  const saved = await session.put(at('/findings', id), { doc, version })
  expect(saved.status, JSON.stringify(saved.body)).toBe(200)
  return saved.body.data
}

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  const otherOrg = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    co: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    otherReviewer: ['reviewer'],
    both: ['investigator', 'reviewer'],
    secondLead: ['investigator'],
    client: { roles: ['client'], organisationId: org },
    otherClient: { roles: ['client'], organisationId: otherOrg },
  })
  sessions = await signInAll(app, people)
  const created = await makeCase(db, org, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    coInvestigatorIds: [people.co.id],
    labTechnicianId: people.lab.id,
    reviewerId: people.reviewer.id,
  })
  caseId = created.id
  caseNumber = created.number
  await db('cases').where({ id: caseId }).update({ status: 'drafting' })
  photoId = await uploadPhoto(sessions.lead, caseId, await plainJpeg(400, 300))
  await sessions.lead
    .post(at('/service-events'), {
      kind: 'installation',
      occurredOn: '2020-03-01',
      description: 'Installed on crane 3',
    })
    .expect(201)
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

describe('review: submit, comment, revise, approve', () => {
  it('refuses to submit without a draft, and refuses people who do not lead the case', async () => {
    const empty = await sessions.lead.post(at('/review/submit'))
    expect(empty.status).toBe(409)
    expect(empty.body.error.code).toBe('invalid_transition')
    await saveDraft(sessions.lead, draft())
    await saveDraft(sessions.co, draft(paragraph('Fatigue, with a snatch load as the trigger.')))
    for (const key of ['co', 'reviewer', 'lab'] as const)
      expect((await sessions[key].post(at('/review/submit'))).status, key).toBe(403)
    expect((await sessions.client.post(at('/review/submit'))).status).toBe(404)
    // the review steps are never plain status changes
    const plain = await sessions.lead.post(at('/status'), { status: 'in_review' })
    expect(plain.status).toBe(409)
    expect(await statusOf()).toBe('drafting')
  })

  it('submits the draft: drafting → in review, recorded', async () => {
    const response = await sessions.lead.post(at('/review/submit'))
    expect(response.status, JSON.stringify(response.body)).toBe(200)
    expect(response.body.data.status).toBe('in_review')
    expect(response.body.data.review.authorIds).toEqual(
      [people.lead.id, people.co.id].sort((a, b) => a - b),
    )
    const again = await sessions.lead.post(at('/review/submit'))
    expect(again.status).toBe(409)
  })

  it('keeps threaded comments anchored to a section and a passage, resolvable, for staff only', async () => {
    const comment = await sessions.reviewer.post(at('/review/comments'), {
      sectionKey: 'summary',
      quote: 'fatigue from a thread root',
      body: 'Which thread root? Name the thread and the turn.',
    })
    expect(comment.status, JSON.stringify(comment.body)).toBe(201)
    expect(comment.body.data).toMatchObject({
      sectionKey: 'summary',
      quote: 'fatigue from a thread root',
      parentId: null,
      resolvedAt: null,
    })
    const reply = await sessions.lead.post(at('/review/comments'), {
      parentId: comment.body.data.id,
      body: 'The first engaged thread; added to the summary.',
    })
    expect(reply.status).toBe(201)
    expect(reply.body.data).toMatchObject({ parentId: comment.body.data.id, sectionKey: 'summary' })
    const badSection = await sessions.reviewer.post(at('/review/comments'), {
      sectionKey: 'nonsense',
      body: 'x',
    })
    expect(badSection.status).toBe(400)
    expect((await sessions.lab.post(at('/review/comments'), { body: 'x' })).status).toBe(403)
    const resolved = await sessions.lead.post(
      at(`/review/comments/${reply.body.data.id as number}/resolve`),
    )
    expect(resolved.status).toBe(200)
    const list = (await sessions.reviewer.get(at('/review/comments')).expect(200)).body.data
    expect(list).toHaveLength(2)
    expect(list[0].resolvedAt).not.toBeNull()
    expect(list[0].resolvedByName).toBeTruthy()
    // a client learns nothing of drafts or comments, not even that they exist
    for (const path of ['/review/comments', '/review', '/findings']) {
      const hidden = await sessions.client.get(at(path))
      expect(hidden.status, path).toBe(404)
    }
    expect((await sessions.client.post(at('/review/comments'), { body: 'x' })).status).toBe(404)
  })

  it('asks for revisions only with a reason, only as the assigned reviewer', async () => {
    expect((await sessions.reviewer.post(at('/review/request-revisions'), {})).status).toBe(400)
    const blank = await sessions.reviewer.post(at('/review/request-revisions'), { reason: '  ' })
    expect(blank.status).toBe(400)
    for (const key of ['lead', 'otherReviewer', 'admin'] as const) {
      const response = await sessions[key].post(at('/review/request-revisions'), { reason: 'x' })
      expect(response.status, key).toBe(403)
    }
    const reason = 'Name the thread turn where the origin lies.'
    const response = await sessions.reviewer.post(at('/review/request-revisions'), { reason })
    expect(response.status).toBe(200)
    expect(response.body.data.status).toBe('revisions_requested')
    const step = response.body.data.review.history.at(-1)
    expect(step).toMatchObject({ kind: 'revisions_requested', reason })
    // in revisions requested, the reviewer cannot approve
    expect((await sessions.reviewer.post(at('/review/approve'))).status).toBe(409)
  })

  it('refuses approval by anyone who wrote, leads or co-investigates the draft: 403 four_eyes', async () => {
    await saveDraft(sessions.lead, draft(paragraph('Origin at the first engaged thread.')))
    await sessions.lead.post(at('/review/submit')).expect(200)
    for (const key of ['lead', 'co'] as const) {
      const response = await sessions[key].post(at('/review/approve'))
      expect(response.status, key).toBe(403)
      expect(response.body.error.code, key).toBe('four_eyes')
    }
    // not an author, but not this case's reviewer either
    for (const key of ['otherReviewer', 'admin'] as const) {
      const response = await sessions[key].post(at('/review/approve'))
      expect(response.status, key).toBe(403)
      expect(response.body.error.code, key).toBe('forbidden')
    }
    expect(await statusOf()).toBe('in_review')
  })

  it('approves with the approver, the time and the SHA-256 of the exact content', async () => {
    const response = await sessions.reviewer.post(at('/review/approve'))
    expect(response.status, JSON.stringify(response.body)).toBe(200)
    expect(response.body.data.status).toBe('approved')
    const approval = response.body.data.review.approval
    expect(approval.approverId).toBe(people.reviewer.id)
    expect(Date.now() - Date.parse(approval.approvedAt)).toBeLessThan(60_000)
    // the hash of the stored document, keys sorted, no spaces (RFC 8785-style canonical JSON)
    const row = await db('findings').where({ caseId }).first('doc')
    expect(approval.contentSha256).toBe(sha256(canonical(JSON.parse(row.doc))))
  })
})

/** Canonical JSON written out independently of the product's own: sorted keys, no spaces. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`
  if (value && typeof value === 'object')
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(',')}}`
  return JSON.stringify(value)
}

describe('a person holding both roles', () => {
  it('who wrote the draft as its lead, then was made its reviewer after the lead changed, may not approve', async () => {
    const org = await makeOrganisation(db)
    const created = await makeCase(db, org, people.admin.id, {
      leadInvestigatorId: people.both.id,
      reviewerId: people.otherReviewer.id,
    })
    await db('cases').where({ id: created.id }).update({ status: 'drafting' })
    const doc = { type: 'doc', content: [paragraph('Written by the lead.')] }
    await saveDraft(sessions.both, doc, created.id)
    const current = (await sessions.admin.get(at('', created.id)).expect(200)).body.data
    const moved = await sessions.admin.patch(at('', created.id), {
      version: current.version,
      leadInvestigatorId: people.secondLead.id,
      reviewerId: people.both.id,
    })
    expect(moved.status, JSON.stringify(moved.body)).toBe(200)
    await sessions.secondLead.post(at('/review/submit', created.id)).expect(200)
    const refused = await sessions.both.post(at('/review/approve', created.id))
    expect(refused.status).toBe(403)
    expect(refused.body.error.code).toBe('four_eyes')
    expect(await statusOf(created.id)).toBe('in_review')
    // someone who never wrote it may
    const other = await sessions.admin.get(at('', created.id)).expect(200)
    await sessions.admin
      .patch(at('', created.id), {
        version: other.body.data.version,
        reviewerId: people.otherReviewer.id,
      })
      .expect(200)
    await sessions.otherReviewer.post(at('/review/approve', created.id)).expect(200)
  })
})

describe('issue', () => {
  it('refuses an approval that an edit withdrew, and issue without approval', async () => {
    await saveDraft(sessions.lead, draft(paragraph('Late correction after approval.')))
    expect(await statusOf()).toBe('drafting')
    const approvals = await db('approvals').where({ caseId })
    expect(approvals).toHaveLength(1)
    expect(approvals[0].withdrawnAt).not.toBeNull()
    expect(approvals[0].withdrawnBy).toBe(people.lead.id)
    const refused = await sessions.lead.post(at('/issue'))
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('not_approved')
    // even a case put in "approved" by hand is not issued without a standing approval
    await db('cases').where({ id: caseId }).update({ status: 'approved' })
    const forged = await sessions.lead.post(at('/issue'))
    expect(forged.body.error.code).toBe('not_approved')
    await db('cases').where({ id: caseId }).update({ status: 'drafting' })
    expect(await db('reports').where({ caseId })).toHaveLength(0)
  })

  it('refuses an approved hash that no longer matches the content', async () => {
    await sessions.lead.post(at('/review/submit')).expect(200)
    await sessions.reviewer.post(at('/review/approve')).expect(200)
    // the draft changed without passing through the findings save (as a faulty path might)
    const row = await db('findings').where({ caseId }).first('doc')
    const changed = JSON.parse(row.doc)
    changed.content.push(paragraph('Slipped in after approval'))
    await db('findings')
      .where({ caseId })
      .update({ doc: JSON.stringify(changed) })
    const refused = await sessions.lead.post(at('/issue'))
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('not_approved')
    await db('findings').where({ caseId }).update({ doc: row.doc })
  })

  let reportId: number
  it('issues revision A of <case number>-R, frozen with its figures and live blocks', async () => {
    for (const key of ['reviewer', 'co', 'lab'] as const)
      expect((await sessions[key].post(at('/issue'))).status, key).toBe(403)
    const figureAtIssue = (await sessions.lead.get(`/api/photos/${photoId}/figure`).expect(200))
      .body as Buffer
    const response = await sessions.lead.post(at('/issue'))
    expect(response.status, JSON.stringify(response.body)).toBe(201)
    const report = response.body.data
    reportId = report.id
    expect(report).toMatchObject({ number: `${caseNumber}-R`, revision: 'A', replaces: null })
    expect(report.approvedByName).toBeTruthy()
    expect(report.html).toContain(`src="/api/reports/${reportId}/figures/f1"`)
    expect(report.html).not.toContain('/api/photos/')
    expect(report.liveBlocks.service_history.rows).toHaveLength(1)
    expect(await statusOf()).toBe('issued')
    expect(await db('findings_authors').where({ caseId })).toHaveLength(0)
    const figure = await sessions.lead.get(`/api/reports/${reportId}/figures/f1`).expect(200)
    expect(figure.headers['content-type']).toBe('image/png')
    expect(sha256(figure.body as Buffer)).toBe(report.figures[0].sha256)
    expect(Buffer.compare(figure.body as Buffer, figureAtIssue)).toBe(0)
  })

  it('keeps the issued revision as it was when the case data changes later', async () => {
    const photo = (await sessions.lead.get(`/api/photos/${photoId}`).expect(200)).body.data
    await sessions.lead
      .patch(`/api/photos/${photoId}`, {
        version: photo.version,
        marks: [{ kind: 'arrow', from: { x: 10, y: 10 }, to: { x: 200, y: 150 } }],
      })
      .expect(200)
    await sessions.lead
      .post(at('/service-events'), { kind: 'failure', occurredOn: '2026-01-05', description: 'x' })
      .expect(201)
    const report = (await sessions.lead.get(`/api/reports/${reportId}`).expect(200)).body.data
    expect(report.liveBlocks.service_history.rows).toHaveLength(1)
    const figure = await sessions.lead.get(`/api/reports/${reportId}/figures/f1`).expect(200)
    expect(sha256(figure.body as Buffer)).toBe(report.figures[0].sha256)
    const now = await sessions.lead.get(`/api/photos/${photoId}/figure`).expect(200)
    expect(sha256(now.body as Buffer)).not.toBe(report.figures[0].sha256)
  })

  it('is refused by the database when changed or removed', async () => {
    await expect(
      db('reports').where({ id: reportId }).update({ html: '<p>changed</p>' }),
    ).rejects.toThrow(/immutable/)
    await expect(db('reports').where({ id: reportId }).delete()).rejects.toThrow(/immutable/)
    await expect(
      db('report_figures')
        .where({ reportId })
        .update({ sha256: '0'.repeat(64) }),
    ).rejects.toThrow(/immutable/)
  })

  it('detects a revision tampered with straight in MariaDB, refuses it and records it', async () => {
    const original = (await db('reports').where({ id: reportId }).first('html')).html as string
    const tamper = async (html: string) => {
      await db.raw('DROP TRIGGER reports_sealed')
      await db('reports').where({ id: reportId }).update({ html })
      await db.raw(`CREATE TRIGGER reports_sealed BEFORE UPDATE ON reports
FOR EACH ROW BEGIN
  IF OLD.row_sha256 <> '' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report revisions are immutable';
  END IF;
END`)
    }
    await tamper(original.replace('fatigue', 'overload'))
    for (const path of [`/api/reports/${reportId}`, `/api/reports/${reportId}/figures/f1`]) {
      const refused = await sessions.client.get(path)
      expect(refused.status, path).toBe(500)
      expect(refused.body.error.code).toBe('integrity_error')
    }
    const recorded = await db('audit_events').where({ caseId, action: 'report.integrity_failed' })
    expect(recorded).toHaveLength(2)
    await tamper(original)
    await sessions.client.get(`/api/reports/${reportId}`).expect(200)
  })

  it('detects a tampered figure file', async () => {
    const figure = await db('report_figures').where({ reportId }).first()
    const path = join(uploads, figure.storageKey)
    const bytes = readFileSync(path)
    const changed = Buffer.from(bytes)
    changed[changed.length - 20] = (changed[changed.length - 20] ?? 0) ^ 0xff
    writeFileSync(path, changed)
    const refused = await sessions.lead.get(`/api/reports/${reportId}/figures/f1`)
    expect(refused.status).toBe(500)
    expect(refused.body.error.code).toBe('integrity_error')
    writeFileSync(path, bytes)
    await sessions.lead.get(`/api/reports/${reportId}/figures/f1`).expect(200)
  })
})

describe('the client’s reading room', () => {
  const reportPath = async () => {
    const list = (await sessions.client.get(at('/reports')).expect(200)).body.data
    return `/api/reports/${list[0].id as number}`
  }

  it('lists and reads the organisation’s issued reports; another organisation gets 404', async () => {
    const list = (await sessions.client.get(at('/reports')).expect(200)).body.data
    expect(list.map((r: { revision: string }) => r.revision)).toEqual(['A'])
    const path = await reportPath()
    const report = (await sessions.client.get(path).expect(200)).body.data
    expect(report.html).toContain('Summary')
    expect(report.rowSha256).toMatch(/^[0-9a-f]{64}$/)
    const room = (await sessions.client.get('/api/reports').expect(200)).body.data
    expect(room.map((r: { caseNumber: string }) => r.caseNumber)).toEqual([caseNumber])
    expect((await sessions.otherClient.get('/api/reports').expect(200)).body.data).toEqual([])
    for (const request of [
      sessions.otherClient.get(at('/reports')),
      sessions.otherClient.get(path),
      sessions.otherClient.get(`${path}/figures/f1`),
      sessions.otherClient.get(`${path}/questions`),
    ])
      expect((await request).status).toBe(404)
  })

  it('acknowledges receipt once per person, recorded once', async () => {
    const path = await reportPath()
    const first = await sessions.client.post(`${path}/acknowledge`)
    expect(first.status).toBe(201)
    const again = await sessions.client.post(`${path}/acknowledge`)
    expect(again.status).toBe(200)
    expect(again.body.data.acknowledgedAt).toBe(first.body.data.acknowledgedAt)
    const recorded = await db('audit_events').where({ caseId, action: 'report.acknowledged' })
    expect(recorded).toHaveLength(1)
    expect((await sessions.lead.post(`${path}/acknowledge`)).status).toBe(403)
    const report = (await sessions.lead.get(path).expect(200)).body.data
    expect(report.acknowledgements).toHaveLength(1)
    const list = (await sessions.client.get(at('/reports')).expect(200)).body.data
    expect(list[0].acknowledgedAt).toBe(first.body.data.acknowledgedAt)
  })

  it('takes questions from the client and answers from the lead; both see the thread', async () => {
    const path = await reportPath()
    const asked = await sessions.client.post(`${path}/questions`, {
      body: 'Should the other cranes’ pins be inspected?',
    })
    expect(asked.status).toBe(201)
    const questionId = asked.body.data.id as number
    expect((await sessions.otherClient.post(`${path}/questions`, { body: 'x' })).status).toBe(404)
    expect((await sessions.lead.post(`${path}/questions`, { body: 'x' })).status).toBe(403)
    expect((await sessions.client.post(`${path}/questions`, { body: ' ' })).status).toBe(400)
    const answerPath = `${path}/questions/${questionId}/answers`
    for (const key of ['client', 'reviewer', 'lab'] as const)
      expect((await sessions[key].post(answerPath, { body: 'x' })).status, key).toBe(403)
    const answered = await sessions.lead.post(answerPath, {
      body: 'Yes: inspect pins of the same batch.',
    })
    expect(answered.status).toBe(201)
    const missing = await sessions.lead.post(`${path}/questions/999999/answers`, { body: 'x' })
    expect(missing.status).toBe(404)
    for (const key of ['client', 'lead'] as const) {
      const thread = (await sessions[key].get(`${path}/questions`).expect(200)).body.data
      expect(thread, key).toHaveLength(1)
      expect(thread[0].answers.map((a: { body: string }) => a.body)).toEqual([
        'Yes: inspect pins of the same batch.',
      ])
    }
  })
})

describe('amendments', () => {
  it('refuses a plain way back, and an amendment without a reason or by others', async () => {
    const plain = await sessions.lead.post(at('/status'), { status: 'drafting' })
    expect(plain.status).toBe(409)
    expect((await sessions.lead.post(at('/amend'), {})).status).toBe(400)
    expect((await sessions.lead.post(at('/amend'), { reason: '   ' })).status).toBe(400)
    for (const key of ['reviewer', 'co', 'lab'] as const)
      expect((await sessions[key].post(at('/amend'), { reason: 'x' })).status, key).toBe(403)
    expect(await statusOf()).toBe('issued')
  })

  it('starts a new draft from the issued text, issued as revision B naming A and why', async () => {
    await sessions.lead.post(at('/status'), { status: 'closed' }).expect(200)
    const reason = 'The client reported the correct heat number.'
    const amended = await sessions.lead.post(at('/amend'), { reason })
    expect(amended.status, JSON.stringify(amended.body)).toBe(200)
    expect(await statusOf()).toBe('drafting')
    const revisionA = (await db('reports').where({ caseId, revision: 'A' }).first()) as {
      id: number
      doc: string
    }
    const findings = (await sessions.lead.get(at('/findings')).expect(200)).body.data
    expect(findings.doc).toEqual(JSON.parse(revisionA.doc))
    await saveDraft(sessions.lead, draft(paragraph('Heat number corrected to H 61874.')))
    await sessions.lead.post(at('/review/submit')).expect(200)
    await sessions.reviewer.post(at('/review/approve')).expect(200)
    const issued = await sessions.lead.post(at('/issue'))
    expect(issued.status, JSON.stringify(issued.body)).toBe(201)
    expect(issued.body.data).toMatchObject({
      revision: 'B',
      number: `${caseNumber}-R`,
      replaces: { id: revisionA.id, revision: 'A' },
      amendmentReason: reason,
    })
    const list = (await sessions.client.get(at('/reports')).expect(200)).body.data
    expect(list.map((r: { revision: string }) => r.revision)).toEqual(['B', 'A'])
    expect(list[1].supersededBy).toMatchObject({ revision: 'B' })
    expect(list[0].supersededBy).toBeNull()
    const earlier = await sessions.client.get(`/api/reports/${revisionA.id}`).expect(200)
    expect(earlier.body.data.supersededBy.revision).toBe('B')
  })
})
