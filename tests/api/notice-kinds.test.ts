import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import type { Notice } from '../../server/services/notices/notice-kinds'
import { queueNotice } from '../../server/services/notices/queue-notice'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { signedIn } from '../helpers/api-session'
import { freshMailRig, type MailRig, PUBLIC_URL, type TestClock } from '../helpers/mail'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

type Key = 'admin' | 'lead' | 'lab' | 'reviewer' | 'client' | 'client2' | 'gone' | 'other'
let people: Record<Key, TestPerson>
let caseId: number
let caseNumber: string
let rig: MailRig

const PARTIES = [
  {
    name: 'Insurer’s engineer',
    organisation: 'Cover Mutual',
    email: 'engineer@cover.example.test',
    role: 'insurer',
  },
  { name: 'Supplier’s counsel', organisation: 'Forge Works', email: null, role: 'counsel' },
  {
    name: 'Operator',
    organisation: 'Plant Ltd',
    email: 'ops@plant.example.test',
    role: 'operator',
  },
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
    client2: { roles: ['client'], organisationId: orgA },
    gone: { roles: ['client'], organisationId: orgA, active: false },
    other: { roles: ['client'], organisationId: orgB },
  })
  const record = await makeCase(db, orgA, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    labTechnicianId: people.lab.id,
    reviewerId: people.reviewer.id,
    interestedParties: PARTIES as never,
  })
  caseId = record.id
  caseNumber = record.number
})
let clock: TestClock
beforeEach(async () => {
  ;({ clock, rig } = await freshMailRig(db))
  return () => rig.close()
})
afterAll(() => db.destroy())

/** Everything the local SMTP server received, as [address, subject, text, html]. */
async function received() {
  const rows = (await db('received_mail').orderBy('id')) as {
    toAddresses: string
    subject: string
    text: string
    html: string
  }[]
  return rows.map((row) => ({
    ...row,
    to: /<([^>]+)>/.exec(row.toAddresses)?.[1] ?? row.toAddresses,
  }))
}

async function queueAndDeliver(notice: Notice) {
  await db.transaction((trx) => queueNotice(trx, notice))
  await rig.sender.runOnce()
  return received()
}

const caseLink = (section = '') => `${PUBLIC_URL}/cases/${caseId}${section}`

describe('every kind of notice reaches exactly its people, once, with its link', () => {
  const cases: [string, () => Notice, () => string[], RegExp, string, string?][] = [
    [
      'review requested → the reviewer',
      () => ({ kind: 'review_requested', caseId }),
      () => [people.reviewer.email],
      /: review requested — /,
      '/review',
    ],
    [
      'revisions requested → the lead, with the reason',
      () => ({ kind: 'revisions_requested', caseId, reason: 'Show the <origin> on figure 3.' }),
      () => [people.lead.email],
      /: revisions requested — /,
      '/review',
      'Show the <origin> on figure 3.',
    ],
    [
      'approved → the lead',
      () => ({ kind: 'approved', caseId }),
      () => [people.lead.email],
      /: report approved — /,
      '/review',
    ],
    [
      'client question → the lead',
      () => ({
        kind: 'client_question',
        caseId,
        askedById: people.client.id,
        question: 'When will the report be ready?',
      }),
      () => [people.lead.email],
      /: question from Test client — /,
      '',
      'When will the report be ready?',
    ],
    [
      'answer → the person who asked',
      () => ({ kind: 'answer', caseId, askedById: people.client2.id, answer: 'Next Friday.' }),
      () => [people.client2.email],
      /: your question was answered — /,
      '',
      'Next Friday.',
    ],
    [
      'assigned → the person given the part',
      () => ({ kind: 'assigned', caseId, personId: people.lab.id, part: 'lab' }),
      () => [people.lab.email],
      /: you are the lab technician — /,
      '',
    ],
  ]
  for (const [name, notice, to, subject, section, quote] of cases) {
    it(name, async () => {
      const mail = await queueAndDeliver(notice())
      expect(mail.map((item) => item.to).sort()).toEqual(to().sort())
      for (const item of mail) {
        expect(item.subject.startsWith(`${caseNumber}: `)).toBe(true)
        expect(item.subject).toMatch(subject)
        expect(item.text).toContain(`${caseLink(section)}\n`)
        expect(item.html).toContain(`href="${caseLink(section)}"`)
        if (quote) {
          expect(item.text).toContain(`> ${quote}`)
          expect(item.html).not.toContain('<origin>')
        }
      }
    })
  }

  it('report issued → every active person of the client organisation, subject led by the report number', async () => {
    const mail = await queueAndDeliver({
      kind: 'report_issued',
      caseId,
      reportNumber: 'R-2026-0042',
    })
    expect(mail.map((item) => item.to).sort()).toEqual(
      [people.client.email, people.client2.email].sort(),
    )
    for (const item of mail) {
      expect(item.subject).toBe(`R-2026-0042: report issued for case ${caseNumber}`)
      expect(item.text).toContain(`${caseLink()}\n`)
    }
  })

  it('a notice of destructive testing → the interested parties with an address, through the API', async () => {
    const lead = await signedIn(app, people.lead.email, people.lead.password)
    const sample = await lead
      .post(`/api/cases/${caseId}/samples`, {
        description: 'Fractured connecting-rod bolt',
        receivedFrom: 'Client site',
        receivedOn: '2026-11-20',
        collectedBy: 'M. Okafor',
        storageLocation: 'Evidence store',
        clientVisible: false,
      })
      .expect(201)
    await lead
      .post(`/api/cases/${caseId}/notices`, {
        sampleIds: [sample.body.data.id],
        plannedWork: 'Section the fracture origin for metallography',
        plannedOn: '2026-11-30',
        sentOn: '2026-11-21',
        authorisedBy: 'Client, M. Okafor',
      })
      .expect(201)
    // the API queued the rows on the real clock: the sender's may lag behind on a busy machine
    clock.advanceMinutes(1)
    await rig.sender.runOnce()
    const mail = await received()
    expect(mail.map((item) => item.to).sort()).toEqual([
      'engineer@cover.example.test',
      'ops@plant.example.test',
    ])
    for (const item of mail) {
      expect(item.subject).toBe(`${caseNumber}: notice of destructive testing on 2026-11-30`)
      expect(item.text).toContain('> Section the fracture origin for metallography')
      expect(item.text).toContain(`${caseLink('/evidence/notices')}\n`)
    }
  })

  it('a part nobody holds sends nothing', async () => {
    const empty = await makeCase(db, await makeOrganisation(db), people.admin.id)
    await db('outbox_messages').delete()
    expect(await queueAndDeliver({ kind: 'review_requested', caseId: empty.id })).toEqual([])
    expect(
      await queueAndDeliver({ kind: 'report_issued', caseId: empty.id, reportNumber: 'R-1' }),
    ).toEqual([])
  })
})
