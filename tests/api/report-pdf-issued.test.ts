import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { renderReportPdf } from '../../server/services/reports/pdf'
import { createLocalStorage } from '../../server/storage/local-storage'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { plainJpeg } from '../factories/images'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { flat, pdfPageTexts } from '../helpers/pdf-text'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const uploads = mkdtempSync(join(tmpdir(), 'fractolog-issued-pdf-'))
// laid out in this thread: the worker is measured by `npm run bench:pdf`
const app = createApp({
  db,
  config: testConfig(),
  clientDir: '/nonexistent',
  storage: createLocalStorage(uploads),
  incomingDir: join(uploads, 'incoming'),
  renderReportPdf,
})

type Key = 'admin' | 'lead' | 'reviewer' | 'client' | 'otherClient'
const people = {} as Record<Key, TestPerson>
const sessions = {} as Record<Key, ApiSession>
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
  people.admin = await makePerson(db, ['admin'])
  people.lead = await makePerson(db, ['investigator'])
  people.reviewer = await makePerson(db, ['reviewer'])
  people.client = await makePerson(db, ['client'], { organisationId: org })
  people.otherClient = await makePerson(db, ['client'], { organisationId: otherOrg })
  for (const key of Object.keys(people) as Key[])
    sessions[key] = await signedIn(app, people[key].email, people[key].password)
  const created = await makeCase(db, org, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    reviewerId: people.reviewer.id,
  })
  caseId = created.id
  caseNumber = created.number
  await db('cases').where({ id: caseId }).update({ status: 'drafting' })
  const upload = await sessions.lead.agent
    .post(at('/photos'))
    .set('X-CSRF-Token', sessions.lead.token)
    .attach('file', await plainJpeg(400, 300), 'fracture.jpg')
  expect(upload.status).toBe(201)
  photoId = upload.body.data.id as number
})
afterAll(async () => {
  await db.destroy()
  rmSync(uploads, { recursive: true, force: true })
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
