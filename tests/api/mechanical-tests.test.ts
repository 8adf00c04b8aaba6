import { execFile } from 'node:child_process'
import { createHash } from 'node:crypto'
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { createAnalysisPool } from '../../server/tensile/analysis-pool'
import { seedStarterSpecifications } from '../../server/services/specifications'
import { createLocalStorage } from '../../server/storage/local-storage'
import { analyseSpecimens, STARTER_SPECIFICATIONS } from '../../shared/tensile'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { tinyPng } from '../factories/files'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const run = promisify(execFile)
const db = createTestDb()
const uploads = mkdtempSync(join(tmpdir(), 'fractolog-tensile-'))
// The server's own path: analyses run in a worker thread of the pool.
const pool = createAnalysisPool(1)
const app = createApp({
  db,
  config: testConfig(),
  clientDir: '/nonexistent',
  storage: createLocalStorage(uploads),
  analyseTensile: pool.analyse,
})

// Open 42CrMoS4 records (CC BY 4.0, see tests/fixtures/tensile-42CrMoS4/README.md).
const FIXTURES = resolve('tests/fixtures/tensile-42CrMoS4')
const OPEN_RECORDS = ['46NT71.csv', '46NT73.csv', '46NT75.csv']
const OPTIONS = { spec: '42CrMo4+QT', fitRange: '100:400MPa' }
const bytesOf = (name: string) => readFileSync(join(FIXTURES, name))

type Key = 'admin' | 'lead' | 'lab' | 'otherLab' | 'client' | 'otherClient'
const people = {} as Record<Key, TestPerson>
const sessions = {} as Record<Key, ApiSession>
let caseId: number

beforeAll(async () => {
  await resetDatabase(db)
  await seedStarterSpecifications(db)
  const own = await makeOrganisation(db)
  const other = await makeOrganisation(db)
  people.admin = await makePerson(db, ['admin'])
  people.lead = await makePerson(db, ['investigator'])
  people.lab = await makePerson(db, ['lab'])
  people.otherLab = await makePerson(db, ['lab'])
  people.client = await makePerson(db, ['client'], { organisationId: own })
  people.otherClient = await makePerson(db, ['client'], { organisationId: other })
  for (const key of Object.keys(people) as Key[])
    sessions[key] = await signedIn(app, people[key].email, people[key].password)
  const assigned = { leadInvestigatorId: people.lead.id, labTechnicianId: people.lab.id }
  caseId = (await makeCase(db, own, people.admin.id, assigned)).id
})
afterAll(async () => {
  await pool.close()
  await db.destroy()
  rmSync(uploads, { recursive: true, force: true })
})

/** A JSON column, whichever way the driver hands it over. */
const parsed = (value: string | object): unknown =>
  typeof value === 'string' ? JSON.parse(value) : value
const count = async (table: string) =>
  Number(((await db(table).count({ n: '*' })) as [{ n: number }])[0].n)
const storedFiles = () => readdirSync(uploads, { recursive: true }).length
const casePath = (rest: string) => `/api/cases/${caseId}${rest}`

async function addSpecimen(label: string, extra: object = {}) {
  const response = await sessions.lab.post(casePath('/specimens'), { label, ...extra })
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data as { id: number; calibrationLapsed: boolean }
}

function upload(
  session: ApiSession,
  specimenId: number,
  bytes: Buffer,
  name: string,
  options: unknown = OPTIONS,
) {
  const request = session.agent
    .post(casePath(`/specimens/${specimenId}/tensile-records`))
    .set('X-CSRF-Token', session.token)
    .attach('file', bytes, name)
  return options === undefined
    ? request
    : request.field('options', typeof options === 'string' ? options : JSON.stringify(options))
}

async function uploaded(specimenId: number, name: string, options: unknown = OPTIONS) {
  const response = await upload(sessions.lab, specimenId, bytesOf(name), name, options)
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data as { id: number; sha256: string; result: Record<string, unknown> }
}

const recordOf = async (session: ApiSession, recordId: number) => {
  const list = await session.get(casePath('/specimens')).expect(200)
  const records = (list.body.data.specimens as { records: { id: number }[] }[]).flatMap(
    (specimen) => specimen.records,
  )
  return records.find((record) => record.id === recordId) as
    | { id: number; version: number; state: string; superseded: boolean; revision: number }
    | undefined
}

describe('specification library', () => {
  it('starts with the engine’s starter records, each marked unverified', async () => {
    const response = await sessions.lab.get('/api/specifications').expect(200)
    const records = response.body.data as { designation: string; unverified: boolean }[]
    expect(records.map((r) => r.designation).sort()).toEqual(
      STARTER_SPECIFICATIONS.map((s) => s.designation).sort(),
    )
    expect(records.every((record) => record.unverified)).toBe(true)
    expect(await seedStarterSpecifications(db)).toBe(0)
  })

  it('lets administrators add records with size bands and record a check against the edition', async () => {
    const band = {
      overMm: 16,
      upToMm: 40,
      yield: { min: 750, kind: 'Rp0.2' },
      tensileStrength: { min: 1000, max: 1200 },
      elongation: [{ minPct: 11, basis: { kind: 'proportional', k: 5.65 } }],
      reductionOfAreaMinPct: 45,
      hardness: null,
    }
    const body = {
      designation: 'Lab 42CrMo4 16-40',
      standard: 'EN 10083-3',
      edition: null,
      grade: '42CrMo4+QT',
      productForm: 'bar',
      units: 'MPa',
      bands: [band],
      source: 'typed in for the test',
    }
    expect((await sessions.lab.post('/api/specifications', body)).status).toBe(403)
    const created = await sessions.admin.post('/api/specifications', body)
    expect(created.status, JSON.stringify(created.body)).toBe(201)
    expect(created.body.data.bands[0]).toEqual(band)
    const refused = await sessions.admin.post('/api/specifications', { ...body, bands: [] })
    expect(refused.status).toBe(400)
    const starter = (await sessions.admin.get('/api/specifications')).body.data.find(
      (record: { designation: string }) => record.designation === 'S355J2',
    )
    const checked = await sessions.admin.patch(`/api/specifications/${starter.id}`, {
      checkedAgainstEdition: '2019',
      version: starter.version,
    })
    expect(checked.status).toBe(200)
    expect(checked.body.data).toMatchObject({ unverified: false, checkedAgainstEdition: '2019' })
    expect((await sessions.client.get('/api/specifications')).status).toBe(403)
  })
})

describe('specimens', () => {
  it('flags equipment that was out of calibration on the test date', async () => {
    const late = await addSpecimen('CAL-1', {
      testedOn: '2026-03-10',
      machine: 'Frame 2',
      machineCalibrationDue: '2026-03-01',
    })
    expect(late.calibrationLapsed).toBe(true)
    const inDate = await addSpecimen('CAL-2', {
      testedOn: '2026-03-10',
      extensometerCalibrationDue: '2026-06-01',
    })
    expect(inDate.calibrationLapsed).toBe(false)
    expect((await sessions.lab.post(casePath('/specimens'), { label: 'CAL-1' })).status).toBe(409)
    expect((await sessions.otherLab.post(casePath('/specimens'), { label: 'X' })).status).toBe(403)
  })
})

describe('raw-record upload', () => {
  it('stores the command line’s --json result for several open records, the bytes kept as sent', async () => {
    const cli = await run(
      process.execPath,
      [
        '--import',
        'tsx',
        'server/cli/analyze.ts',
        ...OPEN_RECORDS.map((name) => join(FIXTURES, name)),
        '--json',
        '--spec',
        OPTIONS.spec,
        '--fit-range',
        OPTIONS.fitRange,
      ],
      { maxBuffer: 10 * 1024 * 1024 },
    )
    const expected = (JSON.parse(cli.stdout) as Record<string, unknown>[]).slice(0, -1)
    for (const [index, name] of OPEN_RECORDS.entries()) {
      const specimen = await addSpecimen(`OPEN-${index}`)
      const data = await uploaded(specimen.id, name)
      const { file: _cliFile, ...cliResult } = expected[index]!
      const { file, ...result } = data.result
      expect(file).toBe(name)
      expect(result).toEqual(cliResult)
      expect(data.sha256).toBe(createHash('sha256').update(bytesOf(name)).digest('hex'))
      const original = await sessions.lab
        .get(casePath(`/tensile-records/${data.id}/file`))
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = []
          res.on('data', (chunk: Buffer) => chunks.push(chunk))
          res.on('end', () => done(null, Buffer.concat(chunks)))
        })
      expect(original.status).toBe(200)
      expect(Buffer.compare(original.body as Buffer, bytesOf(name))).toBe(0)
    }
  }, 120_000)

  it('refuses bad files and options with a clear message and stores nothing', async () => {
    const specimen = await addSpecimen('BAD')
    const records = await count('tensile_records')
    const files = storedFiles()
    const junk = Buffer.from('a,b\n1,2\n3,4\n')
    const engineMessage = (() => {
      try {
        analyseSpecimens([{ name: 'junk.csv', source: junk.toString('utf8') }], {})
      } catch (error) {
        return (error as Error).message
      }
      return 'the engine accepted the junk record'
    })()
    const bad = await upload(sessions.lab, specimen.id, junk, 'junk.csv', {})
    expect(bad.status).toBe(422)
    expect(bad.body.error).toMatchObject({ code: 'tensile_input', message: engineMessage })
    const unknownOption = await upload(sessions.lab, specimen.id, bytesOf('46NT71.csv'), 'a.csv', {
      fitRnage: '1:2MPa',
    })
    expect(unknownOption.status).toBe(422)
    expect(unknownOption.body.error.message).toContain('fitRnage')
    const badRange = await upload(sessions.lab, specimen.id, bytesOf('46NT71.csv'), 'a.csv', {
      fitRange: '400:100MPa',
    })
    expect(badRange.status).toBe(422)
    expect(badRange.body.error.message).toMatch(/^fitRange/)
    const notJson = await upload(sessions.lab, specimen.id, bytesOf('46NT71.csv'), 'a.csv', '{')
    expect(notJson.status).toBe(400)
    const picture = await upload(sessions.lab, specimen.id, await tinyPng(), 'record.csv', {})
    expect(picture.status).toBe(415)
    const noFile = await sessions.lab.post(casePath(`/specimens/${specimen.id}/tensile-records`))
    expect(noFile.status).toBe(400)
    const elsewhere = await upload(sessions.lab, 999_999, bytesOf('46NT71.csv'), 'a.csv')
    expect(elsewhere.status).toBe(404)
    expect(await count('tensile_records')).toBe(records)
    expect(storedFiles()).toBe(files)
  })
})

describe('recompute, confirm, revise, invalidate', () => {
  it('recomputes a draft in place and records the old and new values', async () => {
    const specimen = await addSpecimen('FIT-1')
    const { id } = await uploaded(specimen.id, '46NT77.csv', { fitRange: '100:400MPa' })
    const before = await recordOf(sessions.lab, id)
    const response = await sessions.lab.post(casePath(`/tensile-records/${id}/recompute`), {
      options: { fitRange: '200:600MPa', offset: '0.2,1' },
      version: before!.version,
    })
    expect(response.status, JSON.stringify(response.body)).toBe(200)
    expect(response.body.data.result.modulusFit.chosenBy).toBe('fit range')
    expect(response.body.data.result.modulusFit.fromMPa).toBeGreaterThanOrEqual(200)
    expect(Object.keys(response.body.data.result.yieldStrengthsMPa).sort()).toEqual(['0.2', '1'])
    const entry = await db('audit_events')
      .where({ caseId, action: 'tensile_record.recomputed' })
      .orderBy('id', 'desc')
      .first()
    const details = parsed(entry.details as string | object) as {
      from: { options: object }
      to: { options: object }
    }
    expect(details.from.options).toEqual({ fitRange: '100:400MPa' })
    expect(details.to.options).toEqual({ fitRange: '200:600MPa', offset: '0.2,1' })
    expect(entry.actorId).toBe(people.lab.id)
    const stale = await sessions.lab.post(casePath(`/tensile-records/${id}/recompute`), {
      options: {},
      version: before!.version,
    })
    expect(stale.status).toBe(409)
    const refused = await sessions.lab.post(casePath(`/tensile-records/${id}/recompute`), {
      options: { fitRange: 'soon' },
      version: before!.version + 1,
    })
    expect(refused.status).toBe(422)
  })

  it('lets only the lab technician or an administrator confirm; a confirmed record changes by revision', async () => {
    const specimen = await addSpecimen('CONF-1')
    const { id } = await uploaded(specimen.id, '46NT79.csv')
    const path = casePath(`/tensile-records/${id}/confirm`)
    expect((await sessions.lead.post(path, { version: 1 })).status).toBe(403)
    expect((await sessions.otherLab.post(path, { version: 1 })).status).toBe(403)
    const confirmed = await sessions.lab.post(path, { version: 1 })
    expect(confirmed.status).toBe(200)
    expect(confirmed.body.data).toMatchObject({ state: 'confirmed', confirmedBy: people.lab.id })
    expect((await sessions.lab.post(path, { version: 2 })).status).toBe(409)
    const revised = await sessions.lab.post(casePath(`/tensile-records/${id}/recompute`), {
      options: { ...OPTIONS, fitRange: '150:450MPa' },
      version: 2,
    })
    expect(revised.status).toBe(200)
    expect(revised.body.data).toMatchObject({ revision: 2, revisionOf: id, state: 'draft' })
    const old = await recordOf(sessions.lab, id)
    expect(old).toMatchObject({ state: 'confirmed', superseded: true })
    const oldRow = await db('tensile_records').where({ id }).first()
    expect(parsed(oldRow.options as string | object)).toEqual(OPTIONS)
  })

  it('keeps invalid records visible, links the retest and leaves them out of the summary', async () => {
    const specimen = await addSpecimen('INV-1')
    const first = await uploaded(specimen.id, '46NT81.csv')
    const retest = await uploaded(specimen.id, '46NT83.csv')
    const before = await sessions.lab.get(casePath('/specimens')).expect(200)
    const response = await sessions.lab.post(casePath(`/tensile-records/${first.id}/invalidate`), {
      reason: 'fracture_outside_gauge',
      note: 'Broke at the shoulder radius.',
      retestRecordId: retest.id,
      version: 1,
    })
    expect(response.status, JSON.stringify(response.body)).toBe(200)
    expect(response.body.data).toMatchObject({ state: 'invalid', retestRecordId: retest.id })
    const after = await sessions.lab.get(casePath('/specimens')).expect(200)
    expect(after.body.data.summary.specimens).toBe(before.body.data.summary.specimens - 1)
    expect(await recordOf(sessions.lab, first.id)).toMatchObject({ state: 'invalid' })
    const own = await sessions.lab.post(casePath(`/tensile-records/${retest.id}/invalidate`), {
      reason: 'other',
      retestRecordId: retest.id,
      version: 1,
    })
    expect(own.status).toBe(400)
    const again = await sessions.lab.post(casePath(`/tensile-records/${first.id}/confirm`), {
      version: 2,
    })
    expect(again.status).toBe(409)
  })

  it('shows clients only confirmed, current results of their own cases', async () => {
    const specimen = await addSpecimen('CLIENT-1')
    const draft = await uploaded(specimen.id, '46NT85.csv')
    const shown = await uploaded(specimen.id, '46NT87.csv')
    await sessions.lab.post(casePath(`/tensile-records/${shown.id}/confirm`), { version: 1 })
    const list = await sessions.client.get(casePath('/specimens')).expect(200)
    const records = (
      list.body.data.specimens as { records: { state: string; superseded: boolean }[] }[]
    ).flatMap((specimen) => specimen.records)
    expect(records.length).toBeGreaterThan(0)
    expect(records.every((r) => r.state === 'confirmed' && !r.superseded)).toBe(true)
    expect(list.body.data.summary.specimens).toBe(records.length)
    expect(records.map((r) => (r as unknown as { id: number }).id)).not.toContain(draft.id)
    expect(records.map((r) => (r as unknown as { id: number }).id)).toContain(shown.id)
    expect((await sessions.otherClient.get(casePath('/specimens'))).status).toBe(404)
    const first = records[0] as unknown as { id: number }
    expect((await sessions.client.get(casePath(`/tensile-records/${first.id}/file`))).status).toBe(
      403,
    )
  })
})
