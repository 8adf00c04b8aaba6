import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { findingsTemplate } from '../../shared/findings/template'
import type { CaseState } from '../../shared/workflow/case-states'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { uploadPhoto } from '../factories/photos'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const { app, cleanup } = appWithUploads(db)

type Key = 'admin' | 'lead' | 'co' | 'otherInvestigator' | 'lab' | 'reviewer' | 'client'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number
let otherCaseId: number
let photoId: number
let otherCasePhotoId: number

beforeAll(async () => {
  await resetDatabase(db)
  const org = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    co: ['investigator'],
    otherInvestigator: ['investigator'],
    lab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: org },
  })
  sessions = await signInAll(app, people)
  const parts = {
    leadInvestigatorId: people.lead.id,
    coInvestigatorIds: [people.co.id],
    labTechnicianId: people.lab.id,
    reviewerId: people.reviewer.id,
  }
  caseId = (await makeCase(db, org, people.admin.id, parts)).id
  otherCaseId = (await makeCase(db, org, people.admin.id, parts)).id
  await setState('drafting')
  photoId = await uploadPhoto(sessions.lead, caseId)
  otherCasePhotoId = await uploadPhoto(sessions.lead, otherCaseId)
  for (const text of ['Beach marks on the fracture face', 'Ratchet marks at the thread root'])
    await sessions.lead.post(`/api/cases/${caseId}/observations`, { text }).expect(201)
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

const findings = (id = caseId) => `/api/cases/${id}/findings`
const setState = (status: CaseState, id = caseId) => db('cases').where({ id }).update({ status })
const currentVersion = async () =>
  (await sessions.lead.get(findings()).expect(200)).body.data.version as number

const paragraph = (text: string) => ({ type: 'paragraph', content: [{ type: 'text', text }] })
const discussion = (...blocks: object[]) => ({
  type: 'doc',
  content: [
    {
      type: 'heading',
      attrs: { level: 2, section: 'discussion' },
      content: [{ type: 'text', text: 'Discussion' }],
    },
    ...blocks,
  ],
})

describe('the findings draft', () => {
  it('starts as the template of the usual sections, version 0, for staff only', async () => {
    const response = await sessions.reviewer.get(findings(otherCaseId)).expect(200)
    expect(response.body.data).toMatchObject({ version: 0, updatedAt: null, authors: [] })
    expect(response.body.data.doc).toEqual(findingsTemplate())
    expect(response.body.data.html).toContain('<h2>Discussion</h2>')
    await sessions.lab.get(findings(otherCaseId)).expect(200)
    // a client learns nothing of a draft, not even that there is one
    const client = await sessions.client.get(findings(otherCaseId))
    expect(client.status).toBe(404)
    expect(client.body.error.code).toBe('not_found')
  })

  it('saves with a version, renders figures, opinions and live blocks, and lists the author', async () => {
    const doc = discussion(
      { type: 'figure', attrs: { figureId: 'f1', photoId, caption: 'Fracture face <origin>' } },
      {
        type: 'paragraph',
        content: [
          { type: 'text', text: 'The origin is at the thread root (see ' },
          { type: 'figureRef', attrs: { figureId: 'f1' } },
          { type: 'text', text: ').' },
        ],
      },
      { type: 'liveBlock', attrs: { kind: 'samples' } },
      {
        type: 'opinion',
        attrs: { observations: [2, 1], assumptions: 'Loads as stated by the operator' },
        content: [paragraph('Fatigue from the thread root.')],
      },
    )
    const saved = await sessions.lead.put(findings(), { doc, version: 0 })
    expect(saved.status, JSON.stringify(saved.body)).toBe(200)
    const data = saved.body.data
    expect(data.version).toBe(1)
    expect(data.updatedBy).toBe(people.lead.id)
    expect(data.authors.map((a: { id: number }) => a.id)).toEqual([people.lead.id])
    expect(data.html).toContain(`<img src="/api/photos/${photoId}/figure"`)
    expect(data.html).toContain('Figure 1. Fracture face &lt;origin&gt;')
    expect(data.html).toContain('>Figure 1</a>')
    expect(data.html).toContain('Opinion, based on O-1, O-2')
    expect(data.html).toContain('data-kind="samples"')
    expect(data.flags).toEqual([])
    expect(data.doc.content[4].attrs.observations).toEqual([1, 2])
  })

  it('lets exactly one of two saves of the same version win; the other gets the current draft', async () => {
    const version = await currentVersion()
    const [a, b] = await Promise.all([
      sessions.lead.put(findings(), { doc: discussion(paragraph('Text of the lead')), version }),
      sessions.co.put(findings(), {
        doc: discussion(paragraph('Text of the co-investigator')),
        version,
      }),
    ])
    const statuses = [a.status, b.status].sort()
    expect(statuses).toEqual([200, 409])
    const loser = a.status === 409 ? a : b
    const winner = a.status === 409 ? b : a
    expect(loser.body.error.code).toBe('version_conflict')
    expect(loser.body.error.details.current.version).toBe(version + 1)
    expect(loser.body.error.details.current.doc).toEqual(winner.body.data.doc)
    const winnerId = winner === a ? people.lead.id : people.co.id
    expect(winner.body.data.updatedBy).toBe(winnerId)
    expect(winner.body.data.authors.map((p: { id: number }) => p.id)).toContain(winnerId)
  })

  it('records everyone who saves as an author and notes one editing session per hour', async () => {
    let version = await currentVersion()
    for (const key of ['co', 'co', 'lead'] as const) {
      await sessions[key]
        .put(findings(), { doc: discussion(paragraph(`Saved by ${key}`)), version })
        .expect(200)
      version += 1
    }
    const view = (await sessions.reviewer.get(findings()).expect(200)).body.data
    expect(view.authors.map((a: { id: number }) => a.id).sort()).toEqual(
      [people.lead.id, people.co.id].sort(),
    )
    const edits = await db('audit_events').where({ caseId, action: 'findings.edited' })
    expect(edits.filter((e) => e.actorId === people.co.id)).toHaveLength(1)
    expect(edits.filter((e) => e.actorId === people.lead.id)).toHaveLength(1)
  })

  it('refuses writers who are not the case’s investigators, and closed states', async () => {
    const version = await currentVersion()
    const body = { doc: discussion(paragraph('Not mine to write')), version }
    for (const key of ['otherInvestigator', 'lab', 'reviewer', 'admin'] as const) {
      const response = await sessions[key].put(findings(), body)
      expect(response.status, key).toBe(403)
    }
    expect((await sessions.client.put(findings(), body)).status).toBe(404)
    for (const state of ['intake', 'in_review', 'issued', 'closed'] as const) {
      await setState(state)
      expect((await sessions.lead.put(findings(), body)).status, state).toBe(403)
    }
    await setState('examination')
    await sessions.lead.put(findings(), body).expect(200)
    await setState('drafting')
    expect(await currentVersion()).toBe(version + 1)
  })

  it('withdraws an approval when an approved draft is edited, and says so in the activity', async () => {
    await setState('approved')
    const version = await currentVersion()
    await sessions.lead
      .put(findings(), { doc: discussion(paragraph('A late correction')), version })
      .expect(200)
    const row = await db('cases').where({ id: caseId }).first('status')
    expect(row.status).toBe('drafting')
    const withdrawn = await db('audit_events').where({
      caseId,
      action: 'findings.approval_withdrawn',
    })
    expect(withdrawn).toHaveLength(1)
    expect(withdrawn[0].details.reason).toMatch(/edited after approval/)
  })

  it('refuses documents with unknown elements, foreign photos or unknown observations, changing nothing', async () => {
    const version = await currentVersion()
    const refused = [
      { type: 'doc', content: [{ type: 'script', content: [] }] },
      {
        type: 'doc',
        content: [
          { type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'style' }] }] },
        ],
      },
      {
        type: 'doc',
        content: [{ type: 'image', attrs: { src: 'https://elsewhere.example/x.png' } }],
      },
      discussion({
        type: 'figure',
        attrs: { figureId: 'f9', photoId: otherCasePhotoId, caption: '' },
      }),
      discussion({ type: 'opinion', attrs: { observations: [99], assumptions: '' }, content: [] }),
      { type: 'paragraph' },
    ]
    for (const doc of refused) {
      const response = await sessions.lead.put(findings(), { doc, version })
      expect(response.status, JSON.stringify(doc)).toBe(422)
      expect(response.body.error.code).toBe('invalid_document')
    }
    await sessions.lead.put(findings(), { version }).expect(400)
    expect(await currentVersion()).toBe(version)
  })

  it('drops link targets and attributes the editor does not make, and escapes every text', async () => {
    const version = await currentVersion()
    const doc = discussion({
      type: 'paragraph',
      attrs: { style: 'background:url(javascript:alert(1))', onclick: 'alert(1)' },
      content: [
        { type: 'text', text: '<script>alert(1)</script>' },
        {
          type: 'text',
          text: 'safe link',
          marks: [{ type: 'link', attrs: { href: 'https://example.org/a', onmouseover: 'x' } }],
        },
      ],
    })
    const saved = await sessions.lead.put(findings(), { doc, version }).expect(200)
    expect(saved.body.data.html).not.toMatch(/<script|onclick|onmouseover|javascript:|style=/i)
    expect(saved.body.data.html).toContain('&lt;script&gt;')
    const bad = discussion({
      type: 'paragraph',
      content: [
        {
          type: 'text',
          text: 'x',
          marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }],
        },
      ],
    })
    expect((await sessions.lead.put(findings(), { doc: bad, version: version + 1 })).status).toBe(
      422,
    )
  })

  it('flags an opinion that cites no observation', async () => {
    const version = await currentVersion()
    const doc = discussion({
      type: 'opinion',
      attrs: { observations: [] },
      content: [paragraph('Overload.')],
    })
    const saved = await sessions.lead.put(findings(), { doc, version }).expect(200)
    expect(saved.body.data.flags.map((f: { kind: string }) => f.kind)).toEqual(['opinion_uncited'])
    expect(saved.body.data.html).toContain('Opinion (cites no observation)')
  })

  it('takes a draft larger than the usual body limit and refuses one over its own', async () => {
    const version = await currentVersion()
    const long = Array.from({ length: 300 }, (_, i) => paragraph(`${i} ${'x'.repeat(900)}`))
    await sessions.lead.put(findings(), { doc: discussion(...long), version }).expect(200)
    const huge = Array.from({ length: 30 }, () => paragraph('y'.repeat(90_000)))
    const response = await sessions.lead.put(findings(), {
      doc: discussion(...huge),
      version: version + 1,
    })
    expect(response.status).toBe(413)
    expect(await currentVersion()).toBe(version + 1)
  })
})
