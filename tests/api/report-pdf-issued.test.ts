import { writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { renderReportPdf } from '../../server/services/reports/pdf'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { plainJpeg } from '../factories/images'
import { uploadPhoto } from '../factories/photos'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { flat, pdfPageTexts } from '../helpers/pdf-text'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
// laid out in this thread: the worker is measured by `npm run bench:pdf`
const { app, uploads, cleanup } = appWithUploads(db, { renderReportPdf })

type Key = 'admin' | 'lead' | 'reviewer' | 'client' | 'otherClient'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let caseNumber: string
let photoId: number

const at = (path: string) => `/api/cases/${caseId}${path}`
const draft = (text: string) => ({
  type: 'doc',
  content: [
    {
      type: 'heading',
      attrs: { level: 2, section: 'summary' },
      content: [{ type: 'text', text: 'Summary' }],
    },
    { type: 'paragraph', content: [{ type: 'text', text }] },
    { type: 'figure', attrs: { figureId: 'f1', photoId, caption: 'Fracture face, σ ≤ 200 MPa' } },
  ],
})

async function issue(text: string): Promise<number> {
  const version = (await sessions.lead.get(at('/findings')).expect(200)).body.data.version
  await sessions.lead.put(at('/findings'), { doc: draft(text), version }).expect(200)
  await sessions.lead.post(at('/review/submit')).expect(200)
  await sessions.reviewer.post(at('/review/approve')).expect(200)
  await sessions.lead.post(at('/issue')).expect(201)
  const reports = await sessions.lead.get(at('/reports')).expect(200)
  return reports.body.data[0].id as number
}

function download(session: ApiSession, reportId: number) {
  return session.agent
    .get(`/api/reports/${reportId}/pdf`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = []
      res.on('data', (chunk: Buffer) => chunks.push(chunk))
      res.on('end', () => done(null, Buffer.concat(chunks)))
    })
}

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  const otherOrg = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
    otherClient: { roles: ['client'], organisationId: otherOrg },
  })
  sessions = await signInAll(app, people)
  const created = await makeCase(db, org, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    reviewerId: people.reviewer.id,
  })
  caseId = created.id
  caseNumber = created.number
  await db('cases').where({ id: caseId }).update({ status: 'drafting' })
  photoId = await uploadPhoto(sessions.lead, caseId, await plainJpeg(400, 300))
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

describe('the PDF of an issued revision', () => {
  let revisionA: number

  it('is made at issue and served as stored to the client, with number and revision on every page', async () => {
    revisionA = await issue('The pin failed by fatigue from a thread root.')
    const stored = await db('report_pdfs').where({ reportId: revisionA }).first()
    expect(stored.sha256).toMatch(/^[0-9a-f]{64}$/)
    const response = await download(sessions.client, revisionA)
    expect(response.status).toBe(200)
    expect(response.headers['content-type']).toBe('application/pdf')
    expect(response.headers['content-disposition']).toContain(`${caseNumber}-R-A.pdf`)
    const pages = await pdfPageTexts(response.body as Buffer)
    pages.forEach((page, index) => {
      expect(flat(page)).toContain(`${caseNumber}-R`)
      expect(flat(page)).toContain(`Page ${index + 1} of ${pages.length}`)
    })
    const whole = flat(pages.join(' '))
    expect(whole).toContain('Figure 1. Fracture face, σ ≤ 200 MPa')
    expect(whole).not.toContain('Draft — not issued')
    // served unchanged: the same bytes again, no second layout
    const again = await download(sessions.lead, revisionA)
    expect(Buffer.compare(again.body as Buffer, response.body as Buffer)).toBe(0)
  })

  it('is not there for another organisation, and the row cannot be changed', async () => {
    expect((await download(sessions.otherClient, revisionA)).status).toBe(404)
    await expect(
      db('report_pdfs')
        .where({ reportId: revisionA })
        .update({ sha256: 'x'.repeat(64) }),
    ).rejects.toThrow(/immutable/)
  })

  it('names the revision an amendment replaces, and why', async () => {
    const reason = 'The hardness traverse was added.'
    await sessions.lead.post(at('/amend'), { reason }).expect(200)
    const revisionB = await issue('Fatigue from a thread root; hardness within the range.')
    const response = await download(sessions.client, revisionB)
    const text = flat((await pdfPageTexts(response.body as Buffer)).join(' '))
    expect(text).toContain(
      `This revision B replaces revision A. Reason for the amendment: ${reason}`,
    )
  })

  it('refuses a stored file that no longer matches its hash, and records it', async () => {
    const stored = await db('report_pdfs').where({ reportId: revisionA }).first()
    writeFileSync(join(uploads, stored.storageKey), Buffer.from('%PDF-1.7 tampered'))
    const response = await sessions.client.get(`/api/reports/${revisionA}/pdf`)
    expect(response.status).toBe(500)
    expect(response.body.error.code).toBe('integrity_error')
    const recorded = await db('audit_events').where({ caseId, action: 'report.integrity_failed' })
    expect(recorded.some((row) => row.details.part === 'PDF')).toBe(true)
  })
})
