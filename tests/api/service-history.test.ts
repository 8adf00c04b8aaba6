import { createHash } from 'node:crypto'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { tinyPdf, tinyPng } from '../factories/files'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const { app, uploads, cleanup } = appWithUploads(db)

type Key = 'admin' | 'lead' | 'lab' | 'client' | 'client2'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number

beforeAll(async () => {
  await resetDatabase(db)
  const orgA = await makeOrganisation(db)
  const orgB = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    lab: ['lab'],
    client: { roles: ['client'], organisationId: orgA },
    client2: { roles: ['client'], organisationId: orgB },
  })
  sessions = await signInAll(app, people)
  caseId = (await makeCase(db, orgA, people.admin.id, { leadInvestigatorId: people.lead.id })).id
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

const events = () => `/api/cases/${caseId}/service-events`
const count = async (table: string) =>
  Number(((await db(table).count({ n: '*' })) as [{ n: number }])[0].n)

async function addEvent(body: object = {}) {
  const response = await sessions.lead.post(events(), {
    kind: 'inspection',
    occurredOn: '2024-04-02',
    description: 'Magnetic particle inspection of the pin bore; no indications.',
    hours: 18_200,
    ...body,
  })
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data as { id: number; version: number }
}

function upload(session: ApiSession, eventId: number, bytes: Buffer, name: string) {
  return session.agent
    .post(`${events()}/${eventId}/attachments`)
    .set('X-CSRF-Token', session.token)
    .attach('file', bytes, name)
}

describe('service events', () => {
  it('adds events in date order, old dates included, each with one activity row', async () => {
    const before = await count('audit_events')
    await addEvent({ kind: 'failure', occurredOn: '2026-09-30', hours: 41_000 })
    await addEvent({ kind: 'manufacture', occurredOn: '1887-05-12', hours: null })
    const list = await sessions.lab.get(events()).expect(200)
    const days = list.body.data.map((event: { occurredOn: string }) => event.occurredOn)
    expect(days).toEqual([...days].sort())
    expect(days[0]).toBe('1887-05-12')
    expect(await count('audit_events')).toBe(before + 2)
  })

  it('refuses future and impossible dates, bad kinds and negative readings, writing nothing', async () => {
    const before = await count('service_events')
    const refusals: [object, string][] = [
      [{ occurredOn: '2999-01-01' }, 'occurredOn'],
      [{ occurredOn: '1799-12-31' }, 'occurredOn'],
      [{ occurredOn: '2025-02-29' }, 'occurredOn'],
      [{ kind: 'earthquake' }, 'kind'],
      [{ hours: -5 }, 'hours'],
      [{ cycles: 2.5 }, 'cycles'],
      [{ temperatureC: -300 }, 'temperatureC'],
      [{ description: '   ' }, 'description'],
    ]
    for (const [change, field] of refusals) {
      const response = await sessions.lead.post(events(), {
        kind: 'repair',
        occurredOn: '2020-01-01',
        description: 'Weld repair',
        ...change,
      })
      expect(response.status, JSON.stringify(change)).toBe(400)
      expect(response.body.error.details[0].path, JSON.stringify(change)).toBe(field)
    }
    expect(await count('service_events')).toBe(before)
  })

  it('edits with the version read and answers a stale one with 409', async () => {
    const event = await addEvent()
    const edited = await sessions.lead
      .patch(`${events()}/${event.id}`, { version: 1, hours: 18_250, clientVisible: true })
      .expect(200)
    expect(edited.body.data).toMatchObject({ hours: 18_250, clientVisible: true, version: 2 })
    const stale = await sessions.admin.patch(`${events()}/${event.id}`, { version: 1, hours: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('version_conflict')
    expect(stale.body.error.details.current.hours).toBe(18_250)
  })

  it('lets only the people who keep the case change it', async () => {
    const event = await addEvent()
    const before = await count('service_events')
    await sessions.lab
      .post(events(), { kind: 'other', occurredOn: '2020-01-01', description: 'x' })
      .expect(403)
    await sessions.lab.patch(`${events()}/${event.id}`, { version: 1, hours: 2 }).expect(403)
    await sessions.client.delete(`${events()}/${event.id}`, { version: 1 }).expect(403)
    await sessions.client2.get(events()).expect(404)
    expect(await count('service_events')).toBe(before)
  })

  it('removes an event with its documents, and the removal is on the trail', async () => {
    const event = await addEvent()
    await upload(sessions.lead, event.id, tinyPdf(), 'old report.pdf').expect(201)
    await sessions.lead.delete(`${events()}/${event.id}`, { version: 1 }).expect(204)
    expect(await db('service_events').where({ id: event.id }).first()).toBeUndefined()
    expect(await db('attachments').where({ serviceEventId: event.id }).first()).toBeUndefined()
    const removed = await db('audit_events').where({ action: 'service_event.removed' })
    expect(removed.length).toBeGreaterThan(0)
  })
})

describe('documents attached to an event', () => {
  it('keeps a PDF byte for byte with its SHA-256 (FIPS 180-4, via node:crypto)', async () => {
    const event = await addEvent({ clientVisible: true })
    const pdf = tinyPdf()
    const response = await upload(sessions.lead, event.id, pdf, '../../etc/drawing.pdf').expect(201)
    expect(response.body.data).toMatchObject({
      fileName: 'drawing.pdf',
      mediaType: 'application/pdf',
      size: pdf.length,
      sha256: createHash('sha256').update(pdf).digest('hex'),
    })
    const served = await sessions.client
      .get(`/api/attachments/${response.body.data.id}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = []
        res.on('data', (chunk: Buffer) => chunks.push(chunk))
        res.on('end', () => done(null, Buffer.concat(chunks)))
      })
      .expect(200)
    expect(served.headers['content-type']).toBe('application/pdf')
    expect(Buffer.compare(served.body as Buffer, pdf)).toBe(0)
  })

  it('recognises the type by content: a PNG named .pdf is a PNG, text named .pdf is refused', async () => {
    const event = await addEvent()
    const png = await upload(sessions.lead, event.id, await tinyPng(), 'sketch.pdf').expect(201)
    expect(png.body.data.mediaType).toBe('image/png')
    const before = await count('attachments')
    const text = await upload(sessions.lead, event.id, Buffer.from('%PDX not really'), 'a.pdf')
    expect(text.status).toBe(415)
    expect(text.body.error.code).toBe('unsupported_file_type')
    const missing = await sessions.lead.agent
      .post(`${events()}/${event.id}/attachments`)
      .set('X-CSRF-Token', sessions.lead.token)
      .field('note', 'no file')
    expect(missing.status).toBe(400)
    expect(await count('attachments')).toBe(before)
  })

  it('shows clients only client-visible events and their documents; others answer 404', async () => {
    const hidden = await addEvent({ clientVisible: false, description: 'Internal note on the pin' })
    const hiddenDoc = await upload(sessions.lead, hidden.id, tinyPdf(), 'internal.pdf').expect(201)
    const list = await sessions.client.get(events()).expect(200)
    const ids = list.body.data.map((event: { id: number }) => event.id)
    expect(ids).not.toContain(hidden.id)
    expect(list.body.data.every((event: { clientVisible: boolean }) => event.clientVisible)).toBe(
      true,
    )
    const internal = await sessions.client.get(`/api/attachments/${hiddenDoc.body.data.id}`)
    const missing = await sessions.client.get('/api/attachments/987654')
    expect(internal.status).toBe(404)
    expect(internal.body).toEqual(missing.body)
    const otherOrg = await sessions.client2.get(`/api/attachments/${hiddenDoc.body.data.id}`)
    expect(otherOrg.status).toBe(404)
    await sessions.client2.get('/api/attachments/0x1').expect(400)
  })

  it('refuses to serve a file whose bytes changed on disk, with 500 integrity_error', async () => {
    const event = await addEvent()
    const doc = await upload(sessions.lead, event.id, tinyPdf(), 'r.pdf').expect(201)
    const row = await db('attachments').where({ id: doc.body.data.id }).first()
    const { writeFileSync } = await import('node:fs')
    writeFileSync(join(uploads, row.storageKey), 'tampered')
    const response = await sessions.lab.get(`/api/attachments/${doc.body.data.id}`)
    expect(response.status).toBe(500)
    expect(response.body.error.code).toBe('integrity_error')
  })
})
