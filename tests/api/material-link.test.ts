import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { readLiveBlocks } from '../../server/services/findings/live-blocks'
import { conformityStatement } from '../../server/services/reports/conformity-statement'
import { seedStarterSpecifications } from '../../server/services/specifications'
import { createLocalStorage } from '../../server/storage/local-storage'
import { UNVERIFIED_MARK } from '../../shared/schemas/specifications'
import { NOT_LINKED } from '../../shared/specifications/case-conformity'
import { analyseSpecimens, VERDICT_CAUTION } from '../../shared/tensile'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const uploads = mkdtempSync(join(tmpdir(), 'fractolog-link-'))
const app = createApp({
  db,
  config: testConfig(),
  clientDir: '/nonexistent',
  storage: createLocalStorage(uploads),
})

// Open 42CrMoS4 record 46NT71 (CC BY 4.0, tests/fixtures/tensile-42CrMoS4/README.md); its lab
// states Rp0.2 1132.3 MPa, Rm 1198.7 MPa, A 14.6 %, Z 55.4 % on a 5 mm bar with L0 = 25 mm.
const RECORD = '46NT71.csv'
const bytes = readFileSync(join(resolve('tests/fixtures/tensile-42CrMoS4'), RECORD))
const OPTIONS = { fitRange: '100:400MPa', uncertainty: '10MPa,0.5%', uncertaintySource: 'budget' }

/*
 * EN 10083-3 (2006), 42CrMo4 / 42CrMoS4 quenched and tempered, by diameter: limits recalled from
 * memory, not read from the standard. What the checks rest on: Rm 1198.7 MPa lies inside
 * 1100–1300 (≤ 16 mm) and inside 1000–1200 (16–40 mm, 1.3 MPa below the maximum), and above the
 * 900–1100 of 40–100 mm.
 */
const band = (overMm: number | null, upToMm: number, limits: number[]) => ({
  overMm,
  upToMm,
  yield: { min: limits[0], kind: 'Rp0.2' },
  tensileStrength: { min: limits[1], max: limits[2] },
  elongation: [{ minPct: limits[3], basis: { kind: 'proportional', k: 5.65 } }],
  reductionOfAreaMinPct: limits[4],
  hardness: null,
})
const LIBRARY_RECORD = {
  designation: '42CrMoS4+QT test',
  standard: 'EN 10083-3',
  edition: '2006',
  grade: '42CrMoS4, quenched and tempered',
  productForm: 'bar',
  units: 'MPa',
  bands: [
    band(null, 16, [900, 1100, 1300, 10, 40]),
    band(16, 40, [750, 1000, 1200, 11, 45]),
    band(40, 100, [650, 900, 1100, 12, 50]),
  ],
  source: 'EN 10083-3:2006, quenched and tempered, by diameter (recalled from memory)',
}

type Key = 'admin' | 'lead' | 'other' | 'lab' | 'reviewer' | 'client' | 'client2'
const people = {} as Record<Key, TestPerson>
const sessions = {} as Record<Key, ApiSession>
let orgA: number
let recordId: number
let starterId: number

beforeAll(async () => {
  await resetDatabase(db)
  await seedStarterSpecifications(db)
  orgA = await makeOrganisation(db)
  const orgB = await makeOrganisation(db)
  people.admin = await makePerson(db, ['admin'])
  people.lead = await makePerson(db, ['investigator'])
  people.other = await makePerson(db, ['investigator'])
  people.lab = await makePerson(db, ['lab'])
  people.reviewer = await makePerson(db, ['reviewer'])
  people.client = await makePerson(db, ['client'], { organisationId: orgA })
  people.client2 = await makePerson(db, ['client'], { organisationId: orgB })
  for (const key of Object.keys(people) as Key[])
    sessions[key] = await signedIn(app, people[key].email, people[key].password)
  const created = await sessions.admin.post('/api/specifications', LIBRARY_RECORD)
  expect(created.status, JSON.stringify(created.body)).toBe(201)
  recordId = created.body.data.id
  const library = (await sessions.admin.get('/api/specifications')).body.data as {
    id: number
    designation: string
  }[]
  starterId = library.find((r) => r.designation === '42CrMo4+QT')!.id
})
afterAll(async () => {
  await db.destroy()
  rmSync(uploads, { recursive: true, force: true })
})

const newCase = (overrides = {}) =>
  makeCase(db, orgA, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    labTechnicianId: people.lab.id,
    ...overrides,
  })

async function versionOf(caseId: number): Promise<number> {
  return ((await db('cases').where({ id: caseId }).first('version')) as { version: number }).version
}

async function link(caseId: number, change: object, session = sessions.lead) {
  return session.patch(`/api/cases/${caseId}`, { ...change, version: await versionOf(caseId) })
}

describe('linking a case’s material to a library record and size band', () => {
  it('lets the lead link a record and band, with the section size, in one recorded edit', async () => {
    const created = await newCase()
    const change = { specificationId: recordId, specificationBand: 1, sectionSizeMm: 36 }
    const response = await link(created.id, change)
    expect(response.status, JSON.stringify(response.body)).toBe(200)
    expect(response.body.data).toMatchObject({ ...change, version: 2 })
    const activity = await db('audit_events').where({ caseId: created.id, action: 'case.updated' })
    expect(activity).toHaveLength(1)
    const stored = activity[0].details as string | { changes: object }
    const details =
      typeof stored === 'string' ? (JSON.parse(stored) as { changes: object }) : stored
    expect(details.changes).toEqual({
      specificationId: { from: null, to: recordId },
      specificationBand: { from: null, to: 1 },
      sectionSizeMm: { from: null, to: 36 },
    })
  })

  it('refuses a missing record, a band the record lacks and a size outside the band chosen', async () => {
    const created = await newCase()
    const missing = await link(created.id, { specificationId: 999999, specificationBand: 0 })
    expect(missing.status).toBe(400)
    expect(missing.body.error.details[0]).toEqual({
      path: 'specificationId',
      message: 'No such specification record in the library.',
    })
    const noBand = await link(created.id, { specificationId: recordId, specificationBand: 3 })
    expect(noBand.body.error.details[0]).toEqual({
      path: 'specificationBand',
      message: 'Choose one of the record’s 3 size bands.',
    })
    const unchosen = await link(created.id, { specificationId: recordId })
    expect(unchosen.body.error.details[0].path).toBe('specificationBand')
    const outside = await link(created.id, {
      specificationId: recordId,
      specificationBand: 0,
      sectionSizeMm: 60,
    })
    expect(outside.status).toBe(400)
    expect(outside.body.error.message).toBe(
      'A section of 60 mm is outside the band chosen (up to 16 mm): choose the band over 40 up to 100 mm.',
    )
    // "over 16 up to 40": 16 mm itself belongs to the band below (common practice)
    const edge = await link(created.id, {
      specificationId: recordId,
      specificationBand: 1,
      sectionSizeMm: 16,
    })
    expect(edge.body.error.message).toContain('choose the band up to 16 mm')
    const bandAlone = await link(created.id, { specificationBand: 0 })
    expect(bandAlone.body.error.details[0].message).toBe('Choose a specification record first.')
    const negative = await link(created.id, { sectionSizeMm: -3 })
    expect(negative.status).toBe(400)
    expect(await versionOf(created.id)).toBe(1)
  })

  it('lets only the case’s staff who edit it set the link; other organisations see no case', async () => {
    const created = await newCase()
    const change = { specificationId: recordId, specificationBand: 0 }
    for (const key of ['other', 'lab', 'reviewer', 'client'] as const)
      expect((await link(created.id, change, sessions[key])).status, key).toBe(403)
    expect((await link(created.id, change, sessions.client2)).status).toBe(404)
    expect(await versionOf(created.id)).toBe(1)
    expect((await link(created.id, change, sessions.admin)).status).toBe(200)
  })
})

async function uploadRecord(caseId: number, label: string) {
  const specimen = await sessions.lab.post(`/api/cases/${caseId}/specimens`, { label })
  expect(specimen.status).toBe(201)
  const response = await sessions.lab.agent
    .post(`/api/cases/${caseId}/specimens/${specimen.body.data.id}/tensile-records`)
    .set('X-CSRF-Token', sessions.lab.token)
    .attach('file', bytes, RECORD)
    .field('options', JSON.stringify(OPTIONS))
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data as { id: number; result: unknown; caseConformity: unknown }
}

interface Listed {
  specimens: { records: { id: number; caseConformity: Judged }[] }[]
  conformity: { judged: boolean; overall?: string; reason?: string; caution?: string }
}
type Judged =
  | { judged: false; reason: string }
  | {
      judged: true
      link: { designation: string; band: string; unverified: boolean }
      conformity: { overall: string; rule: string; items: { property: string; verdict: string }[] }
    }

async function listed(caseId: number, session = sessions.lead): Promise<Listed> {
  const response = await session.get(`/api/cases/${caseId}/specimens`)
  expect(response.status).toBe(200)
  return response.body.data as Listed
}
const onlyRecord = (list: Listed) => list.specimens[0]!.records[0]!.caseConformity

describe('conformity against the linked band', () => {
  it('says plainly that nothing is judged while no record is linked, and keeps the engine’s answer', async () => {
    const created = await newCase()
    const uploaded = await uploadRecord(created.id, 'N-1')
    // The engine's answer is the command line's, untouched: no `spec` option, no conformity.
    const { file: _file, ...engine } = analyseSpecimens(
      [{ name: RECORD, source: bytes.toString('utf8') }],
      OPTIONS,
    ) as unknown as Record<string, unknown>
    expect(uploaded.result).toEqual({ file: RECORD, ...engine })
    expect(engine.conformity).toBeNull()
    expect(uploaded.caseConformity).toEqual({ judged: false, reason: NOT_LINKED })
    const list = await listed(created.id)
    expect(onlyRecord(list)).toEqual({ judged: false, reason: NOT_LINKED })
    expect(list.conformity).toEqual({ judged: false, reason: NOT_LINKED })
    await sessions.lab.post(`/api/cases/${created.id}/tensile-records/${uploaded.id}/confirm`, {
      version: 1,
    })
    expect(await conformityStatement(db, created.id)).toEqual([NOT_LINKED])
  })

  it('judges against the band the case names: the same record passes one band and fails another', async () => {
    const created = await newCase()
    const uploaded = await uploadRecord(created.id, 'B-1')
    await link(created.id, { specificationId: recordId, specificationBand: 0, sectionSizeMm: 12 })
    const small = onlyRecord(await listed(created.id))
    expect(small.judged && small.conformity.overall).toBe('pass')
    expect(small.judged && small.link.band).toBe('up to 16 mm')
    await link(created.id, { specificationBand: 2, sectionSizeMm: 60 })
    const large = await listed(created.id)
    const judged = onlyRecord(large)
    expect(judged.judged && judged.conformity.overall).toBe('fail')
    const rm = judged.judged ? judged.conformity.items.filter((i) => i.property === 'Rm') : []
    expect(rm.map((item) => item.verdict)).toEqual(['pass', 'fail']) // ≥ 900, ≤ 1100
    expect(large.conformity).toMatchObject({
      judged: true,
      overall: 'fail',
      caution: VERDICT_CAUTION,
    })
    // the stored engine answer did not change with the link
    const row = await db('tensile_records').where({ id: uploaded.id }).first('result')
    expect(JSON.parse(row.result as string).conformity).toBeNull()
  })

  it('uses the case’s decision rule with the uncertainty stored with the record', async () => {
    const created = await newCase({ decisionRule: 'guard_band' })
    await uploadRecord(created.id, 'G-1')
    await link(created.id, { specificationId: recordId, specificationBand: 1, sectionSizeMm: 36 })
    // Rm 1198.7 MPa is 1.3 MPa below the 1200 MPa maximum: inside U = 10 MPa, so inconclusive
    const guarded = onlyRecord(await listed(created.id))
    expect(guarded.judged && guarded.conformity.overall).toBe('inconclusive')
    expect(guarded.judged && guarded.conformity.rule).toContain('guard band')
    await link(created.id, { decisionRule: 'simple' })
    const simple = onlyRecord(await listed(created.id))
    expect(simple.judged && simple.conformity.overall).toBe('pass')
  })

  it('marks a verdict that rests on unverified starter limits, in the list, the live block and the report', async () => {
    const created = await newCase()
    const uploaded = await uploadRecord(created.id, 'U-1')
    await link(created.id, { specificationId: starterId, specificationBand: 0, sectionSizeMm: 10 })
    const judged = onlyRecord(await listed(created.id))
    expect(judged.judged && judged.link).toMatchObject({
      designation: '42CrMo4+QT',
      unverified: true,
    })
    await sessions.lab.post(`/api/cases/${created.id}/tensile-records/${uploaded.id}/confirm`, {
      version: 1,
    })
    const statement = await conformityStatement(db, created.id)
    expect(statement[0]).toBe(
      'Specification: 42CrMo4+QT 42CrMo4 / 42CrMoS4, quenched and tempered (EN 10083-3, edition not stated), size band up to 16 mm; section 10 mm.',
    )
    expect(statement).toContain(VERDICT_CAUTION)
    expect(statement).toContain(UNVERIFIED_MARK)
    const blocks = await readLiveBlocks(db, created.id, ['tensile_results'])
    expect(blocks.tensile_results?.rows[0]?.at(-1)).toBe('meets')
    expect(blocks.tensile_results?.notes).toContain(UNVERIFIED_MARK)
  })

  it('shows clients the verdict of confirmed results of their own cases only', async () => {
    const created = await newCase()
    const draft = await uploadRecord(created.id, 'C-1')
    const shown = await uploadRecord(created.id, 'C-2')
    await link(created.id, { specificationId: recordId, specificationBand: 0 })
    expect((await listed(created.id, sessions.client)).specimens).toEqual([])
    await sessions.lab.post(`/api/cases/${created.id}/tensile-records/${shown.id}/confirm`, {
      version: 1,
    })
    const seen = await listed(created.id, sessions.client)
    const ids = seen.specimens.flatMap((s) => s.records.map((r) => r.id))
    expect(ids).toEqual([shown.id])
    expect(ids).not.toContain(draft.id)
    const verdict = onlyRecord(seen)
    expect(verdict.judged && verdict.conformity.overall).toBe('pass')
    expect(seen.conformity).toMatchObject({
      judged: true,
      overall: 'pass',
      caution: VERDICT_CAUTION,
    })
    const file = `/api/cases/${created.id}/tensile-records/${shown.id}/file`
    expect((await sessions.client.get(file)).status).toBe(403)
    expect((await sessions.client2.get(file)).status).toBe(404)
    expect((await sessions.client2.get(`/api/cases/${created.id}/specimens`)).status).toBe(404)
  })
})
