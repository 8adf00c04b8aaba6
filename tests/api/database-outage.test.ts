import { join } from 'node:path'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDb, type Db } from '../../server/db/knex'
import { migrateLatest } from '../../server/db/migrations'
import { makeOrganisation, makePerson } from '../factories'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { ownMariadb, type OwnMariadb } from '../helpers/own-mariadb'
import { startServerProcess, type ServerProcess } from '../helpers/server-process'

// The server runs as a process of its own against a MariaDB of this test's own (not the one the
// other API tests share); the test stops that MariaDB under a small load and starts it again.

/** A generous bound that catches a request hanging for a driver's timeout (10 s and more). */
const QUICK_MS = 4_000
const WORKERS = 3

let mariadb: OwnMariadb
let server: ServerProcess
let databaseUrl: string
let organisationId: number
let sessions: ApiSession[] = []

interface Outcome {
  status: number
  code?: string
  ms: number
  caseId?: number
}

beforeAll(async () => {
  mariadb = await ownMariadb('outage')
  databaseUrl = await mariadb.databaseUrl('fractolog_outage')
  const db = createDb(databaseUrl, { min: 0, max: 2 })
  try {
    await migrateLatest(db)
    organisationId = await makeOrganisation(db, 'Rowan Lifting')
    const people = await Promise.all(
      Array.from({ length: WORKERS }, () => makePerson(db, ['investigator'])),
    )
    server = await startServerProcess(databaseUrl, join(mariadb.options.dataDir, 'uploads'))
    sessions = await Promise.all(
      people.map((person) => signedIn(server.url, person.email, person.password)),
    )
  } finally {
    await db.destroy()
  }
}, 90_000)

afterAll(async () => {
  if (server?.alive()) {
    server.child.kill('SIGKILL')
    await server.exited
  }
  await mariadb?.remove()
})

/** One request's outcome; a request that gets no answer at all counts as status 0. */
async function timed(send: () => PromiseLike<{ status: number; body: unknown }>) {
  const started = Date.now()
  const response = await Promise.resolve(send()).catch((error: Error & { code?: string }) => ({
    status: 0,
    body: { error: { code: error.code ?? error.message } },
  }))
  const body = response.body as { error?: { code?: string }; data?: { id?: number } }
  const outcome: Outcome = { status: response.status, ms: Date.now() - started }
  if (body.error?.code) outcome.code = body.error.code
  if (response.status === 201 && body.data?.id) outcome.caseId = body.data.id
  return outcome
}

/** Each worker opens cases and reads the list and itself, one request after the other. */
function startLoad(): { outcomes: Outcome[]; stop: () => Promise<void> } {
  const outcomes: Outcome[] = []
  let running = true
  let sequence = 0
  const worker = async (session: ApiSession) => {
    while (running) {
      const title = `Load case ${++sequence}`
      outcomes.push(
        await timed(() =>
          session
            .post('/api/cases', { title, organisationId, component: 'Sheave', material: 'S355' })
            .timeout(QUICK_MS * 3),
        ),
      )
      outcomes.push(await timed(() => session.get('/api/cases?pageSize=5').timeout(QUICK_MS * 3)))
      outcomes.push(await timed(() => session.get('/api/auth/me').timeout(QUICK_MS * 3)))
      await new Promise((done) => setTimeout(done, 20))
    }
  }
  const done = Promise.all(sessions.map(worker))
  return {
    outcomes,
    stop: async () => {
      running = false
      await done
    },
  }
}

const pause = (ms: number) => new Promise((done) => setTimeout(done, ms))

function health(): Promise<Outcome> {
  return timed(() => request(server.url).get('/api/health').timeout(15_000))
}

async function waitForHealthy(timeoutMs: number): Promise<number> {
  const started = Date.now()
  while (Date.now() - started < timeoutMs) {
    if ((await health()).status === 200) return Date.now() - started
    await pause(200)
  }
  throw new Error(`not healthy within ${timeoutMs} ms:\n${server.output()}`)
}

describe('a database outage under load', () => {
  it('answers 503 quickly, keeps the process alive, recovers by itself and loses nothing', async () => {
    const load = startLoad()
    await pause(1_500)
    const beforeOutage = load.outcomes.length
    await mariadb.stop()
    const stoppedAt = load.outcomes.length
    await pause(3_000)
    const during = load.outcomes.slice(stoppedAt)
    expect(server.alive(), server.output()).toBe(true)
    const healthDuring = await health()
    const newcomer = await timed(() => request(server.url).get('/api/auth/csrf'))
    await mariadb.start()
    const recoveryMs = await waitForHealthy(20_000)
    const recoveredAt = load.outcomes.length
    await pause(1_500)
    await load.stop()
    const after = load.outcomes.slice(recoveredAt)

    // before the outage everything worked
    expect(beforeOutage).toBeGreaterThan(WORKERS * 3)
    expect(load.outcomes.slice(0, beforeOutage).every((o) => o.status < 300)).toBe(true)
    // while it lasted: 503 database_unavailable, quickly, and nothing else went wrong
    expect(during.length).toBeGreaterThan(WORKERS * 3)
    for (const outcome of during) {
      expect(outcome.ms, JSON.stringify(outcome)).toBeLessThan(QUICK_MS)
      if (outcome.status >= 300) {
        expect(outcome, JSON.stringify(outcome)).toMatchObject({
          status: 503,
          code: 'database_unavailable',
        })
      }
    }
    expect(during.filter((o) => o.status === 503).length).toBeGreaterThan(WORKERS * 2)
    expect(healthDuring).toMatchObject({ status: 503, code: 'database_unavailable' })
    expect(healthDuring.ms).toBeLessThan(QUICK_MS)
    // a session that could not be stored is not handed out
    expect(newcomer).toMatchObject({ status: 503, code: 'database_unavailable' })
    // no 500 at any time, and the same sessions work again once MariaDB is back
    expect(load.outcomes.filter((o) => o.status !== 503 && o.status >= 300)).toEqual([])
    expect(recoveryMs).toBeLessThan(20_000)
    expect(after.length).toBeGreaterThan(WORKERS * 3)
    expect(after.every((o) => o.status < 300)).toBe(true)
    expect(server.alive(), server.output()).toBe(true)
    await checkNothingMissingOrHalfWritten(load.outcomes)
  })
})

async function checkNothingMissingOrHalfWritten(outcomes: Outcome[]): Promise<void> {
  const db: Db = createDb(databaseUrl, { min: 0, max: 1 })
  try {
    const answered = outcomes.flatMap((o) => (o.caseId ? [o.caseId] : []))
    expect(answered.length).toBeGreaterThan(WORKERS)
    const stored = (await db('cases').select('id', 'number')) as { id: number; number: string }[]
    const storedIds = new Set(stored.map((row) => row.id))
    expect(answered.filter((id) => !storedIds.has(id))).toEqual([])
    // a case and its activity row are written together: every case has exactly one
    const created = (await db('audit_events')
      .where({ action: 'case.created' })
      .select('caseId')) as { caseId: number }[]
    expect(created.map((row) => row.caseId).sort((a, b) => a - b)).toEqual(
      [...storedIds].sort((a, b) => a - b),
    )
    expect(new Set(stored.map((row) => row.number)).size).toBe(stored.length)
  } finally {
    await db.destroy()
  }
}

describe('SIGTERM', () => {
  it('answers what it accepted, closes the pool and exits with status 0', async () => {
    const requests = sessions.flatMap((session) =>
      Array.from({ length: 6 }, () => timed(() => session.get('/api/cases?pageSize=5'))),
    )
    await Promise.race(requests)
    server.child.kill('SIGTERM')
    const outcomes = await Promise.all(requests)
    expect(await server.exited).toBe(0)
    expect(server.output()).toContain('SIGTERM received, shutting down')
    // every request got its full answer, or never got in (the port was closed)
    for (const outcome of outcomes) {
      if (outcome.status !== 0) expect(outcome.status, JSON.stringify(outcome)).toBe(200)
    }
    expect(outcomes.filter((o) => o.status === 200).length).toBeGreaterThan(0)
    const after = await timed(() => request(server.url).get('/api/health').timeout(2_000))
    expect(after).toMatchObject({ status: 0, code: expect.stringMatching(/ECONNREFUSED/) })
  })
})
