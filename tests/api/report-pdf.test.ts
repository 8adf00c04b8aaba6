import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { createLocalStorage } from '../../server/storage/local-storage'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { figurePng } from '../factories/report-pdf-input'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { pdfPagesAsPng } from '../helpers/pdf-pages'
import { flat, pdfPageTexts } from '../helpers/pdf-text'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const uploads = mkdtempSync(join(tmpdir(), 'fractolog-report-pdf-'))
// the server's own way: each PDF is laid out in a worker thread
const app = createApp({
  db,
  config: testConfig(),
  clientDir: '/nonexistent',
  storage: createLocalStorage(uploads),
  incomingDir: join(uploads, 'incoming'),
})

type Key = 'admin' | 'lead' | 'lab' | 'reviewer' | 'client'
const people = {} as Record<Key, TestPerson>
const sessions = {} as Record<Key, ApiSession>
let caseId: number
let caseNumber: string

const text = (value: string) => ({ type: 'text', text: value })
const paragraph = (...content: object[]) => ({ type: 'paragraph', content })

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db, 'Tallowmere Cranes Ltd')
  people.admin = await makePerson(db, ['admin'])
  people.lead = await makePerson(db, ['investigator'])
  people.lab = await makePerson(db, ['lab'])
  people.reviewer = await makePerson(db, ['reviewer'])
  people.client = await makePerson(db, ['client'], { organisationId: org })
  for (const key of Object.keys(people) as Key[])
    sessions[key] = await signedIn(app, people[key].email, people[key].password)
  await db('users').where({ id: people.lead.id }).update({ name: 'Tomas Reyke' })
  const created = await makeCase(db, org, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    reviewerId: people.reviewer.id,
    labTechnicianId: people.lab.id,
  })
  caseId = created.id
  caseNumber = created.number
  await db('cases').where({ id: caseId }).update({ status: 'drafting' })
}, 60_000)
afterAll(async () => {
  await db.destroy()
  rmSync(uploads, { recursive: true, force: true })
})

describe('laboratory settings', () => {
  it('start as a placeholder, are changed by an administrator and read by staff', async () => {
    const before = await sessions.lab.get('/api/settings/laboratory').expect(200)
    expect(before.body.data).toEqual({
      name: 'Laboratory name not set',
      addressLines: [],
      updatedAt: null,
    })
    const settings = {
      name: '  Kestrelmoor Materials Laboratory ',
      addressLines: ['4 Foundry Row', 'Kestrelmoor KM2 7QT'],
    }
    const saved = await sessions.admin.put('/api/settings/laboratory', settings).expect(200)
    expect(saved.body.data).toMatchObject({
      name: 'Kestrelmoor Materials Laboratory',
      addressLines: ['4 Foundry Row', 'Kestrelmoor KM2 7QT'],
    })
    const read = await sessions.reviewer.get('/api/settings/laboratory').expect(200)
    expect(read.body.data.name).toBe('Kestrelmoor Materials Laboratory')
    const audit = await db('audit_events').where({ action: 'settings.laboratory_changed' })
    expect(audit).toHaveLength(1)
    expect(audit[0].actorId).toBe(people.admin.id)
  })

  it('refuses other people’s changes and addresses that are empty or too long', async () => {
    const body = { name: 'Elsewhere', addressLines: ['1 Road'] }
    expect((await sessions.lead.put('/api/settings/laboratory', body)).status).toBe(403)
    expect((await sessions.client.get('/api/settings/laboratory')).status).toBe(403)
    for (const addressLines of [[], Array(7).fill('A line'), ['']]) {
      const refused = await sessions.admin.put('/api/settings/laboratory', {
        name: 'X',
        addressLines,
      })
      expect(refused.status).toBe(400)
      expect(refused.body.error.code).toBe('validation_failed')
    }
    const unknown = await sessions.admin.put('/api/settings/laboratory', { ...body, logo: 'x' })
    expect(unknown.status).toBe(400)
  })
})

describe('the draft preview PDF', () => {
  it('prints the case’s current draft, watermarked on every page, with its figure and opinion', async () => {
    const upload = await sessions.lead.agent
      .post(`/api/cases/${caseId}/photos`)
      .set('X-CSRF-Token', sessions.lead.token)
      .attach(
        'file',
        await sharp(await figurePng(3, 800, 600))
          .jpeg()
          .toBuffer(),
        'face.jpg',
      )
    expect(upload.status, JSON.stringify(upload.body)).toBe(201)
    const photoId = upload.body.data.id as number
    for (const observation of ['Beach marks on the fracture face', 'Ratchet marks at the root'])
      await sessions.lead
        .post(`/api/cases/${caseId}/observations`, { text: observation })
        .expect(201)
    const doc = {
      type: 'doc',
      content: [
        {
          type: 'heading',
          attrs: { level: 2, section: 'discussion' },
          content: [text('Discussion')],
        },
        paragraph(
          text('Stresses σ ≤ 350 MPa at the origin (see '),
          { type: 'figureRef', attrs: { figureId: 'f1' } },
          text(').'),
        ),
        { type: 'figure', attrs: { figureId: 'f1', photoId, caption: 'Fracture face, origin' } },
        {
          type: 'opinion',
          attrs: { observations: [1, 2], assumptions: '' },
          content: [paragraph(text('Fatigue from the thread root.'))],
        },
        { type: 'liveBlock', attrs: { kind: 'samples' } },
      ],
    }
    await sessions.lead.put(`/api/cases/${caseId}/findings`, { doc, version: 0 }).expect(200)

    const response = await sessions.reviewer
      .get(`/api/cases/${caseId}/findings/pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = []
        res.on('data', (chunk: Buffer) => chunks.push(chunk))
        res.on('end', () => done(null, Buffer.concat(chunks)))
      })
    expect(response.status).toBe(200)
    expect(response.headers['content-type']).toBe('application/pdf')
    expect(response.headers['content-disposition']).toContain(`${caseNumber}-R-draft.pdf`)
    const pdf = response.body as Buffer
    const pages = await pdfPageTexts(pdf)
    pages.forEach((page, index) => {
      expect(flat(page)).toContain('Draft — not issued')
      expect(flat(page)).toContain(`Report ${caseNumber}-R · draft, not issued`)
      expect(flat(page)).toContain(`Page ${index + 1} of ${pages.length}`)
    })
    const whole = flat(pages.join('\n'))
    expect(whole).toContain('Kestrelmoor Materials Laboratory 4 Foundry Row Kestrelmoor KM2 7QT')
    expect(whole).toContain('Client Tallowmere Cranes Ltd')
    expect(whole).toContain('Author Tomas Reyke Lead investigator')
    expect(whole).toContain('Stresses σ ≤ 350 MPa at the origin (see Figure 1).')
    expect(whole).toContain('Figure 1. Fracture face, origin')
    expect(whole).toContain('Opinion, based on O-1, O-2 Fatigue from the thread root.')
    expect(whole).toContain('O-2 Ratchet marks at the root Recorded')
    expect(whole).toContain('Items received and examined Nothing recorded yet.')
    expect(whole).toContain('Not issued: this draft preview carries no authorisation.')
    const images = await pdfPagesAsPng(pdf, 'draft-preview', 2)
    const stats = await sharp(images[1] as string).stats()
    expect(Math.max(...stats.channels.map((channel) => channel.stdev))).toBeGreaterThan(30)
  }, 120_000)

  it('is for staff only: a client learns nothing of the draft', async () => {
    const client = await sessions.client.get(`/api/cases/${caseId}/findings/pdf`)
    expect(client.status).toBe(404)
    expect(client.body.error.code).toBe('not_found')
  })
})
