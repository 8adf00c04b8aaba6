import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { createDb } from '../../server/db/knex'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { applicationDatabaseUrl, createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
const AGENT = 'trail-test/1.0'
const ADDRESS = '192.0.2.44'
let adminPerson: TestPerson
let admin: ApiSession

beforeAll(async () => {
  await resetDatabase(db)
  adminPerson = await makePerson(db, ['admin'])
  admin = await signedIn(app, adminPerson.email, adminPerson.password)
})
afterAll(() => db.destroy())

function client(): ApiSession {
  const session = new ApiSession(app)
  session.agent.set('User-Agent', AGENT).set('X-Forwarded-For', ADDRESS)
  return session
}

/** The rows a piece of work added to the trail. */
async function added(work: () => Promise<unknown>) {
  const [{ last }] = (await db('security_events').max({ last: 'id' })) as [{ last: number | null }]
  await work()
  return db('security_events')
    .where('id', '>', last ?? 0)
    .orderBy('id')
}

function expectOne(rows: Record<string, unknown>[], kind: string, actorId: number | null) {
  const matching = rows.filter((row) => row.kind === kind)
  expect(matching, kind).toHaveLength(1)
  const [row] = matching
  expect(row).toMatchObject({ actorId, address: ADDRESS, userAgent: AGENT })
  expect((row!.at as Date).getTime()).toBeGreaterThan(Date.now() - 60_000)
  return row!
}

describe('the security trail', () => {
  it('records sign-in success and failure, and sign-out, once each', async () => {
    const person = await makePerson(db, ['investigator'])
    const session = client()
    const failed = await added(() => session.signIn(person.email, 'wrong password!'))
    expect(expectOne(failed, 'sign_in.failed', null).email).toBe(person.email)
    const succeeded = await added(() => session.signIn(person.email, person.password))
    expectOne(succeeded, 'sign_in.succeeded', person.id)
    const out = await added(() => session.post('/api/auth/logout').expect(204))
    expectOne(out, 'sign_out', person.id)
  })

  it('records CSRF refusals and refused access: 403s and the 404 of another organisation’s case', async () => {
    const organisationId = await makeOrganisation(db)
    const otherOrganisation = await makeOrganisation(db)
    const hidden = await makeCase(db, otherOrganisation, adminPerson.id)
    const person = await makePerson(db, ['client'], { organisationId })
    const session = client()
    await session.signIn(person.email, person.password)
    const forged = await added(() =>
      session.agent.post('/api/cases').set('X-CSRF-Token', 'forged').send({}).expect(403),
    )
    expectOne(forged, 'csrf.refused', person.id)
    const forbidden = await added(() => session.get('/api/people').expect(403))
    expectOne(forbidden, 'access.refused', person.id)
    const guessed = await added(() => session.get(`/api/cases/${hidden.id}`).expect(404))
    const row = expectOne(guessed, 'access.refused', person.id)
    expect(row.details).toMatchObject({ status: 404, caseId: hidden.id })
    const missing = await added(() => session.get('/api/cases/999999').expect(404))
    expect(missing).toHaveLength(0)
  })

  it('records password change and reset, role, organisation and active changes with before and after', async () => {
    const organisationId = await makeOrganisation(db)
    const otherId = await makeOrganisation(db)
    const person = await makePerson(db, ['lab'])
    const session = client()
    await session.signIn(person.email, person.password)
    const changed = await added(() =>
      session.post('/api/auth/password', {
        currentPassword: person.password,
        newPassword: 'beach marks on the shaft',
      }),
    )
    expectOne(changed, 'password.changed', person.id)
    admin.agent.set('User-Agent', AGENT).set('X-Forwarded-For', ADDRESS)
    const reset = await added(() => admin.post(`/api/people/${person.id}/reset-password`))
    expectOne(reset, 'password.reset', adminPerson.id)
    const edit = { email: person.email, name: 'Lab person', organisationId: null, active: true }
    const roles = await added(() =>
      admin.put(`/api/people/${person.id}`, { ...edit, roles: ['lab', 'reviewer'] }).expect(200),
    )
    expect(expectOne(roles, 'person.roles_changed', adminPerson.id).details).toEqual({
      personId: person.id,
      from: ['lab'],
      to: ['lab', 'reviewer'],
    })
    const client2 = await makePerson(db, ['client'], { organisationId })
    const moved = await added(() =>
      admin
        .put(`/api/people/${client2.id}`, {
          email: client2.email,
          name: 'Client',
          roles: ['client'],
          organisationId: otherId,
          active: false,
        })
        .expect(200),
    )
    const organisationRow = expectOne(moved, 'person.organisation_changed', adminPerson.id)
    expect(organisationRow.details).toEqual({
      personId: client2.id,
      from: organisationId,
      to: otherId,
    })
    expectOne(moved, 'person.deactivated', adminPerson.id)
  })

  it('is listed for administrators only, filtered by kind and paged, newest first', async () => {
    const page = await admin.get('/api/security-events?kind=sign_in.succeeded&page=1').expect(200)
    expect(page.body.page).toMatchObject({ number: 1, size: 25 })
    expect(page.body.data.length).toBeGreaterThan(0)
    for (const row of page.body.data) {
      expect(Object.keys(row).sort()).toEqual(
        ['actorId', 'address', 'at', 'details', 'email', 'id', 'kind', 'userAgent'].sort(),
      )
      expect(row.kind).toBe('sign_in.succeeded')
    }
    const ids = page.body.data.map((row: { id: number }) => row.id)
    expect(ids).toEqual([...ids].sort((a, b) => b - a))
    await admin.get('/api/security-events?kind=nonsense').expect(400)
    const investigator = await makePerson(db, ['investigator'])
    const other = await signedIn(app, investigator.email, investigator.password)
    await other.get('/api/security-events').expect(403)
    await request(app).get('/api/security-events').expect(401)
  })
})

describe('the application’s database account', () => {
  const url = applicationDatabaseUrl()

  it.runIf(url)('may add and read rows of both trails, never change or remove them', async () => {
    const application = createDb(url!, { min: 0, max: 1 })
    try {
      for (const table of ['security_events', 'audit_events']) {
        const kind = table === 'security_events' ? 'kind' : 'action'
        const [id] = (await application(table).insert({ [kind]: 'sign_out' })) as number[]
        expect(await application(table).where({ id }).first()).toBeDefined()
        await expect(
          application(table)
            .where({ id })
            .update({ [kind]: 'x' }),
        ).rejects.toThrow(/UPDATE command denied/)
        await expect(application(table).where({ id }).delete()).rejects.toThrow(
          /DELETE command denied/,
        )
        await expect(application.raw(`TRUNCATE TABLE ${table}`)).rejects.toThrow(/denied/)
      }
      // the other tables are the application's to change, whoever's migration made them
      const person = await makePerson(db, ['lab'])
      await application('users').where({ id: person.id }).update({ name: 'Renamed' })
      await expect(application.schema.dropTable('users')).rejects.toThrow(/denied/)
    } finally {
      await application.destroy()
    }
  })
})
