import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'admin' | 'lead' | 'lab' | 'reviewer' | 'client' | 'client2'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let caseNumber: string

const PARTIES = [
  { name: 'Insurer’s engineer', organisation: 'Cover Mutual', email: null, role: 'insurer' },
  { name: 'Supplier’s counsel', organisation: 'Forge Works', email: null, role: 'counsel' },
]

beforeAll(async () => {
  await resetDatabase(db)
  const orgA = await makeOrganisation(db)
  const orgB = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: orgA },
    client2: { roles: ['client'], organisationId: orgB },
  })
  sessions = await signInAll(app, people)
  const record = await makeCase(db, orgA, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    labTechnicianId: people.lab.id,
    interestedParties: PARTIES as never,
  })
  caseId = record.id
  caseNumber = record.number
})
afterAll(() => db.destroy())

const base = () => `/api/cases/${caseId}`
const count = async (table: string) =>
  Number(((await db(table).count({ n: '*' })) as [{ n: number }])[0].n)

interface SampleBody {
  id: number
  itemId: string
  storageLocation: string | null
  events: { id: number; kind: string; from: string; to: string }[]
  flags: { kind: string; eventId?: number }[]
  holdIds: number[]
}

async function receive(body: object = {}, session = sessions.lead) {
  const response = await session.post(`${base()}/samples`, {
    description: 'Fractured connecting-rod bolt, both halves',
    receivedFrom: 'Client site, M. Okafor',
    receivedOn: '2026-11-20',
    collectedBy: 'M. Okafor',
    storageLocation: 'Evidence store, shelf 2',
    clientVisible: false,
    ...body,
  })
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data as SampleBody
}

async function detail(sampleId: number, session = sessions.lead) {
  const response = await session.get(`${base()}/samples/${sampleId}`).expect(200)
  return response.body.data as SampleBody
}

const custody = (sampleId: number, body: object, session = sessions.lead) =>
  session.post(`${base()}/samples/${sampleId}/custody-events`, {
    kind: 'transferred',
    at: new Date().toISOString(),
    ...body,
  })

async function agreedNotice(sampleIds: number[]) {
  const created = await sessions.lead
    .post(`${base()}/notices`, {
      sampleIds,
      plannedWork: 'Section the fracture origin for metallography',
      plannedOn: '2026-11-30',
      sentOn: '2026-11-21',
      authorisedBy: 'Client, M. Okafor',
    })
    .expect(201)
  const notice = created.body.data as { id: number; parties: { id: number }[] }
  for (const party of notice.parties) {
    await sessions.lead
      .post(`${base()}/notices/${notice.id}/answers`, {
        partyId: party.id,
        answer: 'agreed',
        answeredOn: '2026-11-22',
      })
      .expect(201)
  }
  return notice
}

describe('samples and chain of custody', () => {
  it('gives items ids under the case number and records their receipt as the first event', async () => {
    const first = await receive()
    const second = await receive({ description: 'Nut from the same joint' })
    expect(first.itemId).toMatch(new RegExp(`^${caseNumber}-S\\d+$`))
    expect(Number(second.itemId.split('-S')[1])).toBe(Number(first.itemId.split('-S')[1]) + 1)
    const item = await detail(first.id)
    expect(item.events).toHaveLength(1)
    expect(item.events[0]).toMatchObject({ kind: 'received', from: 'Client site, M. Okafor' })
    expect(item.flags).toEqual([])
  })

  it('refuses bad input and a receipt in the future, writing nothing', async () => {
    const before = await count('samples')
    for (const change of [
      { description: '  ' },
      { receivedOn: '2999-01-01' },
      { cutMethod: 'laser' },
      { clientVisible: 'yes' },
    ]) {
      const response = await sessions.lead.post(`${base()}/samples`, {
        description: 'x',
        receivedFrom: 'y',
        receivedOn: '2026-11-20',
        clientVisible: false,
        ...change,
      })
      expect(response.status, JSON.stringify(change)).toBe(400)
    }
    expect(await count('samples')).toBe(before)
  })

  it('flags a gap where an event’s `from` is not the previous `to`, and shows a correction closing it', async () => {
    const item = await receive()
    const custodian = item.events[0]!.to
    const moved = await custody(item.id, { from: ` ${custodian.toUpperCase()} `, to: 'Bench 3' })
    expect(moved.status, JSON.stringify(moved.body)).toBe(201)
    expect(moved.body.data.flags).toEqual([])
    const gap = await custody(item.id, {
      from: 'Somebody else',
      to: 'Store B',
      location: 'Store B',
    })
    const wrongId = gap.body.data.events.at(-1).id as number
    expect(gap.body.data.flags).toEqual([
      { kind: 'custody_gap', eventId: wrongId, expectedFrom: 'Bench 3', from: 'Somebody else' },
    ])
    expect(gap.body.data.storageLocation).toBe('Store B')
    const fixed = await custody(item.id, { from: 'Bench 3', to: 'Store B', corrects: wrongId })
    expect(fixed.status).toBe(201)
    expect(fixed.body.data.flags).toEqual([])
    expect(fixed.body.data.events.find((e: { id: number }) => e.id === wrongId).correctedBy).toBe(
      fixed.body.data.events.at(-1).id,
    )
    // a correction is corrected by a new one, never twice over the same event
    const twice = await custody(item.id, { from: 'Bench 3', to: 'Store B', corrects: wrongId })
    expect(twice.status).toBe(409)
  })

  it('flags an item sent out and one without a location', async () => {
    const item = await receive({ storageLocation: null })
    expect((await detail(item.id)).flags).toEqual([{ kind: 'no_location' }])
    const sent = await custody(item.id, {
      kind: 'sent_out',
      from: item.events[0]!.to,
      to: 'Outside lab, fractography',
      location: 'Outside lab',
    })
    expect(sent.body.data.flags).toEqual([
      { kind: 'sent_out', eventId: sent.body.data.events.at(-1).id },
    ])
  })

  it('keeps custody append-only: no route and no SQL changes or removes an event', async () => {
    const item = await receive()
    const eventId = item.events[0]!.id
    const path = `${base()}/samples/${item.id}/custody-events/${eventId}`
    expect((await sessions.admin.patch(path, { from: 'x' })).status).toBe(404)
    expect((await sessions.admin.delete(path)).status).toBe(404)
    await expect(
      db('custody_events').where({ id: eventId }).update({ fromParty: 'x' }),
    ).rejects.toThrow(/append-only/)
    await expect(db('custody_events').where({ id: eventId }).delete()).rejects.toThrow(
      /append-only/,
    )
    expect((await detail(item.id)).events[0]!.from).toBe('Client site, M. Okafor')
  })

  it('refuses custody events in the future and corrections of another item’s event', async () => {
    const a = await receive()
    const b = await receive()
    const future = await custody(a.id, { from: 'x', to: 'y', at: '2999-01-01T00:00:00Z' })
    expect(future.status).toBe(400)
    const foreign = await custody(a.id, { from: 'x', to: 'y', corrects: b.events[0]!.id })
    expect(foreign.status).toBe(400)
    expect(foreign.body.error.details[0].path).toBe('corrects')
  })
})

describe('notice before destructive work (ASTM E860 practice)', () => {
  it('refuses sectioning without a notice, then allows it once every party agreed', async () => {
    const item = await receive()
    const piece = {
      description: 'Origin section',
      receivedFrom: item.itemId,
      receivedOn: '2026-11-23',
      parentId: item.id,
      cutLocation: 'Thread root',
      orientation: 'Longitudinal',
      cutMethod: 'abrasive',
      clientVisible: false,
    }
    const before = await count('samples')
    const refused = await sessions.lead.post(`${base()}/samples`, piece)
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('notice_required')
    const byEvent = await custody(item.id, { kind: 'sectioned', from: 'a', to: 'a' })
    expect(byEvent.body.error.code).toBe('notice_required')
    expect(await count('samples')).toBe(before)

    const notice = await agreedNotice([item.id])
    expect(notice.parties).toHaveLength(2)
    const cut = await sessions.lab.post(`${base()}/samples`, piece)
    expect(cut.status, JSON.stringify(cut.body)).toBe(201)
    expect(cut.body.data.itemId).toBe(`${item.itemId}.1`)
    expect(cut.body.data.storageLocation).toBe(item.storageLocation)
    const parent = await detail(item.id)
    expect(parent.events.at(-1)).toMatchObject({ kind: 'sectioned' })
    expect(parent.flags).toEqual([])
    // the notice on the parent covers its pieces too
    const subPiece = await sessions.lab.post(`${base()}/samples`, {
      ...piece,
      parentId: cut.body.data.id,
    })
    expect(subPiece.body.data.itemId).toBe(`${item.itemId}.1.1`)
  })

  it('waits while answers are missing, blocks on an objection until an administrator resolves it', async () => {
    const item = await receive()
    const created = await sessions.lead
      .post(`${base()}/notices`, {
        sampleIds: [item.id],
        plannedWork: 'Cut a tensile specimen',
        plannedOn: new Date().toISOString().slice(0, 10),
        sentOn: new Date().toISOString().slice(0, 10),
        authorisedBy: 'Lead investigator',
      })
      .expect(201)
    const notice = created.body.data
    expect(notice.standing).toBe('waiting')
    const [insurer, counsel] = notice.parties
    await sessions.lead
      .post(`${base()}/notices/${notice.id}/answers`, {
        partyId: insurer.id,
        answer: 'agreed',
        answeredOn: '2026-11-22',
      })
      .expect(201)
    const objected = await sessions.lead
      .post(`${base()}/notices/${notice.id}/answers`, {
        partyId: counsel.id,
        answer: 'objected',
        answeredOn: '2026-11-22',
        comment: 'We want our own expert present.',
      })
      .expect(201)
    expect(objected.body.data.standing).toBe('objected')
    const refused = await custody(item.id, { kind: 'sectioned', from: 'x', to: 'x' })
    expect(refused.body.error.code).toBe('notice_required')

    const answerId = objected.body.data.answers.at(-1).id
    const resolution = `${base()}/notices/${notice.id}/answers/${answerId}/resolution`
    await sessions.lead.post(resolution, { resolution: 'Expert attends on the 30th' }).expect(403)
    await sessions.admin.post(resolution, { resolution: '  ' }).expect(400)
    const resolved = await sessions.admin
      .post(resolution, { resolution: 'Expert attends on the 30th' })
      .expect(200)
    expect(resolved.body.data.standing).toBe('agreed')
    const first = (await detail(item.id)).events[0]!
    await custody(item.id, { kind: 'sectioned', from: first.to, to: first.to }).expect(201)
    await sessions.admin.post(resolution, { resolution: 'again' }).expect(409)
  })

  it('allows the work once the case’s notice period passed with no objection', async () => {
    const item = await receive()
    await sessions.lead.put(`${base()}/notice-period`, { days: 3 }).expect(200)
    const created = await sessions.lead.post(`${base()}/notices`, {
      sampleIds: [item.id],
      plannedWork: 'Hardness traverse across the weld',
      plannedOn: '2026-11-10',
      sentOn: '2026-11-01',
      authorisedBy: 'Lead investigator',
    })
    expect(created.body.data.respondBy).toBe('2026-11-04')
    expect(created.body.data.standing).toBe('period_passed')
    await custody(item.id, {
      kind: 'sectioned',
      from: item.events[0]!.to,
      to: item.events[0]!.to,
    }).expect(201)
    await sessions.lead.put(`${base()}/notice-period`, { days: 10 }).expect(200)
  })

  it('refuses notices on another case’s items and answers from parties not notified', async () => {
    const otherCase = await makeCase(db, await makeOrganisation(db), people.admin.id)
    const [foreignId] = (await db('samples').insert({
      caseId: otherCase.id,
      position: 1,
      itemId: `${otherCase.number}-S1`,
      description: 'x',
      receivedFrom: 'y',
      receivedOn: '2026-11-01',
      createdBy: people.admin.id,
    })) as number[]
    const refused = await sessions.lead.post(`${base()}/notices`, {
      sampleIds: [foreignId],
      plannedWork: 'x',
      plannedOn: '2026-11-30',
      sentOn: '2026-11-21',
      authorisedBy: 'x',
    })
    expect(refused.status).toBe(400)
    const item = await receive()
    const notice = await agreedNotice([item.id])
    const stranger = await sessions.lead.post(`${base()}/notices/${notice.id}/answers`, {
      partyId: 999999,
      answer: 'agreed',
      answeredOn: '2026-11-22',
    })
    expect(stranger.status).toBe(400)
  })
})

describe('legal holds', () => {
  it('locks an item and its pieces until an administrator releases the hold with a reason', async () => {
    const item = await receive()
    await agreedNotice([item.id])
    const held = await sessions.lead
      .post(`${base()}/holds`, { sampleId: item.id, reason: 'Litigation expected' })
      .expect(201)
    const custodian = item.events[0]!.to
    for (const kind of ['transferred', 'sectioned', 'sent_out', 'returned_to_client', 'disposed']) {
      const refused = await custody(item.id, { kind, from: custodian, to: 'Elsewhere' })
      expect(refused.status, kind).toBe(409)
      expect(refused.body.error.code, kind).toBe('legal_hold')
    }
    const piece = await sessions.lead.post(`${base()}/samples`, {
      description: 'Piece',
      receivedFrom: item.itemId,
      receivedOn: '2026-11-23',
      parentId: item.id,
      clientVisible: false,
    })
    expect(piece.body.error.code).toBe('legal_hold')
    expect((await detail(item.id)).holdIds).toEqual([held.body.data.id])

    const release = `${base()}/holds/${held.body.data.id}/release`
    await sessions.lead.post(release, { reason: 'Settled' }).expect(403)
    await sessions.admin.post(release, {}).expect(400)
    const released = await sessions.admin.post(release, { reason: 'Parties settled' }).expect(200)
    expect(released.body.data).toMatchObject({
      releaseReason: 'Parties settled',
      releasedBy: people.admin.id,
    })
    await custody(item.id, { from: custodian, to: 'Bench 1' }).expect(201)
    await sessions.admin.post(release, { reason: 'again' }).expect(409)
    const kinds = (await db('audit_events').where({ caseId }).select('action')).map(
      (r: { action: string }) => r.action,
    )
    expect(kinds).toEqual(expect.arrayContaining(['hold.placed', 'hold.released']))
  })

  it('a hold on the case locks every item in it', async () => {
    const item = await receive()
    const held = await sessions.admin
      .post(`${base()}/holds`, { reason: 'Regulator’s order' })
      .expect(201)
    const refused = await custody(item.id, {
      kind: 'disposed',
      from: item.events[0]!.to,
      to: 'Scrap',
    })
    expect(refused.body.error.code).toBe('legal_hold')
    // receipt and return are still recorded: the record must follow where the item is
    await custody(item.id, { kind: 'returned', from: item.events[0]!.to, to: 'Store' }).expect(201)
    await sessions.admin
      .post(`${base()}/holds/${held.body.data.id}/release`, { reason: 'Order lifted' })
      .expect(200)
  })

  it('lets only the lead or an administrator place a hold', async () => {
    await sessions.lab.post(`${base()}/holds`, { reason: 'x' }).expect(403)
    await sessions.reviewer.post(`${base()}/holds`, { reason: 'x' }).expect(403)
  })
})

describe('who sees and handles the evidence', () => {
  it('shows a client only their organisation’s items marked for them, never by a guessed id', async () => {
    const hidden = await receive()
    const shown = await receive({ clientVisible: true, description: 'Bolt, as received' })
    const list = await sessions.client.get(`${base()}/samples`).expect(200)
    const ids = list.body.data.map((s: { id: number }) => s.id)
    expect(ids).toContain(shown.id)
    expect(ids).not.toContain(hidden.id)
    expect(Object.keys(list.body.data[0]).sort()).toEqual(
      ['caseId', 'condition', 'description', 'id', 'itemId', 'parentId', 'receivedOn'].sort(),
    )
    await sessions.client.get(`${base()}/samples/${hidden.id}`).expect(404)
    await sessions.client.get(`${base()}/samples/${shown.id}`).expect(200)
    await sessions.client2.get(`${base()}/samples`).expect(404)
    await sessions.client2.get(`${base()}/samples/${shown.id}`).expect(404)
    for (const path of ['notices', 'holds', 'observations', 'notice-period']) {
      await sessions.client.get(`${base()}/${path}`).expect(403)
    }
  })

  it('lets the lab technician record custody but not a reviewer or a client', async () => {
    const item = await receive()
    const body = { from: item.events[0]!.to, to: 'Bench 4' }
    await custody(item.id, body, sessions.reviewer).expect(403)
    await custody(item.id, body, sessions.client).expect(403)
    await custody(item.id, body, sessions.lab).expect(201)
  })

  it('answers 404 for an item of another case through this case’s URL', async () => {
    const otherCase = await makeCase(db, await makeOrganisation(db), people.admin.id)
    const [foreignId] = (await db('samples').insert({
      caseId: otherCase.id,
      position: 1,
      itemId: `${otherCase.number}-S1`,
      description: 'x',
      receivedFrom: 'y',
      receivedOn: '2026-11-01',
      createdBy: people.admin.id,
    })) as number[]
    await sessions.admin.get(`${base()}/samples/${foreignId}`).expect(404)
    await custody(foreignId as number, { from: 'a', to: 'b' }, sessions.admin).expect(404)
  })
})
