import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { uploadPhoto } from '../factories/photos'
import { figurePng } from '../factories/report-pdf-input'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { pdfPagesAsPng } from '../helpers/pdf-pages'
import { flat, pdfPageTexts } from '../helpers/pdf-text'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
// the server's own way: each PDF is laid out in a worker thread
const { app, cleanup } = appWithUploads(db)

type Key = 'admin' | 'lead' | 'lab' | 'reviewer' | 'client'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let caseNumber: string

const text = (value: string) => ({ type: 'text', text: value })
const paragraph = (...content: object[]) => ({ type: 'paragraph', content })

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db, 'Tallowmere Cranes Ltd')
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
  })
  sessions = await signInAll(app, people)
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
  cleanup()
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
    const face = await sharp(await figurePng(3, 800, 600))
      .jpeg()
      .toBuffer()
    const photoId = await uploadPhoto(sessions.lead, caseId, face, 'face.jpg')
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
