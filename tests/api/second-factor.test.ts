import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'
import { totpCode } from '../helpers/totp-code'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let admin: ApiSession

beforeAll(async () => {
  await resetDatabase(db)
  const adminPerson = await makePerson(db, ['admin'])
  admin = await signedIn(app, adminPerson.email, adminPerson.password)
})
afterAll(() => db.destroy())

const secretOf = async (id: number) =>
  ((await db('users').where({ id }).first('secondFactorSecret')) as { secondFactorSecret: string })
    .secondFactorSecret
const forgetLastCode = (id: number) =>
  db('users').where({ id }).update({ secondFactorLastStep: null })
const eventsOf = (kind: string) => db('security_events').where({ kind })
const detailsOf = (row: { details: unknown }) =>
  typeof row.details === 'string' ? JSON.parse(row.details) : row.details

/** Sets up a second factor through the API; answers the key and the recovery codes. */
async function enrol(session: ApiSession) {
  const begun = await session.post('/api/auth/second-factor/enrolment').expect(200)
  const { secret, uri, qrCode } = begun.body.data
  expect(qrCode).toMatch(/^data:image\/png;base64,/)
  expect(uri).toMatch(/^otpauth:\/\/totp\/Fractolog:.+\?.*secret=/)
  const confirmed = await session
    .post('/api/auth/second-factor/enrolment/confirm', { code: totpCode(secret) })
    .expect(200)
  await session.refreshToken()
  return { secret: secret as string, recoveryCodes: confirmed.body.data.recoveryCodes as string[] }
}

describe('enrolment', () => {
  it('keeps a staff member without a second factor to setting one up, then lets them work', async () => {
    const person = await makePerson(db, ['investigator'], { secondFactor: false })
    const session = new ApiSession(app)
    const login = await session.signIn(person.email, person.password)
    expect(login.body.data.user.secondFactorSetupRequired).toBe(true)
    const blocked = await session.get('/api/cases').expect(403)
    expect(blocked.body.error.code).toBe('second_factor_setup_required')
    const wrong = await session.post('/api/auth/second-factor/enrolment').expect(200)
    const refused = await session.post('/api/auth/second-factor/enrolment/confirm', {
      code: totpCode(wrong.body.data.secret, Date.now() + 120_000),
    })
    expect(refused.status).toBe(400)
    const { recoveryCodes } = await enrol(session)
    expect(recoveryCodes).toHaveLength(10)
    await session.get('/api/cases').expect(200)
    const stored = await db('recovery_codes').where({ userId: person.id })
    expect(stored).toHaveLength(10)
    expect(JSON.stringify(stored)).not.toContain(recoveryCodes[0])
    expect(await eventsOf('second_factor.enrolled').where({ actorId: person.id })).toHaveLength(1)
    const again = await session.post('/api/auth/second-factor/enrolment')
    expect(again.status).toBe(409)
  })

  it('leaves it to clients unless their organisation requires it', async () => {
    const organisationId = await makeOrganisation(db)
    const client = await makePerson(db, ['client'], { organisationId })
    const session = await signedIn(app, client.email, client.password)
    await session.get('/api/cases').expect(200)
    const organisation = await db('organisations').where({ id: organisationId }).first()
    await admin
      .put(`/api/organisations/${organisationId}`, {
        name: organisation.name,
        contactName: null,
        contactEmail: null,
        active: true,
        requiresSecondFactor: true,
      })
      .expect(200)
    const changed = await eventsOf('organisation.second_factor_changed')
    expect(detailsOf(changed.at(-1))).toMatchObject({ from: false, to: true })
    const blocked = await session.get('/api/cases').expect(403)
    expect(blocked.body.error.code).toBe('second_factor_setup_required')
    await enrol(session)
    await session.get('/api/cases').expect(200)
  })
})

describe('signing in with a second factor', () => {
  let person: TestPerson
  let secret: string
  let recoveryCodes: string[]

  beforeAll(async () => {
    person = await makePerson(db, ['lab'], { secondFactor: false })
    const first = await signedIn(app, person.email, person.password)
    ;({ secret, recoveryCodes } = await enrol(first))
  })

  it('asks for a code after the password; until then every other route answers 401', async () => {
    const session = new ApiSession(app)
    const login = await session.signInWithPasswordOnly(person.email, person.password)
    expect(login.status).toBe(200)
    expect(login.body).toEqual({ data: { secondFactorRequired: true } })
    expect(await session.signedInId()).toBeNull()
    for (const path of ['/api/cases', '/api/staff', '/api/dashboard']) {
      expect((await session.get(path)).status, path).toBe(401)
    }
    await forgetLastCode(person.id)
    const completed = await session.post('/api/auth/second-factor', { code: totpCode(secret) })
    expect(completed.status).toBe(200)
    expect(completed.body.data.user).toMatchObject({ id: person.id, secondFactorEnrolled: true })
    await session.refreshToken()
    await session.get('/api/cases').expect(200)
  })

  it('accepts a code once: the same code again is refused', async () => {
    await forgetLastCode(person.id)
    const code = totpCode(secret)
    const first = new ApiSession(app)
    await first.signInWithPasswordOnly(person.email, person.password)
    await first.post('/api/auth/second-factor', { code }).expect(200)
    const second = new ApiSession(app)
    await second.signInWithPasswordOnly(person.email, person.password)
    const reused = await second.post('/api/auth/second-factor', { code })
    expect(reused.status).toBe(401)
    expect(reused.body.error.code).toBe('invalid_credentials')
    expect(await second.signedInId()).toBeNull()
  })

  it('accepts each recovery code once, and records its use', async () => {
    const session = new ApiSession(app)
    await session.signInWithPasswordOnly(person.email, person.password)
    const used = await session.post('/api/auth/second-factor', { recoveryCode: recoveryCodes[0] })
    expect(used.status).toBe(200)
    const again = new ApiSession(app)
    await again.signInWithPasswordOnly(person.email, person.password)
    const refused = await again.post('/api/auth/second-factor', { recoveryCode: recoveryCodes[0] })
    expect(refused.status).toBe(401)
    const other = await again.post('/api/auth/second-factor', { recoveryCode: recoveryCodes[1] })
    expect(other.status).toBe(200)
    const rows = await eventsOf('second_factor.recovery_code_used').where({ actorId: person.id })
    expect(rows).toHaveLength(2)
  })

  it('refuses a code without the password step first', async () => {
    const session = new ApiSession(app)
    await session.refreshToken()
    const response = await session.post('/api/auth/second-factor', { code: totpCode(secret) })
    expect(response.status).toBe(401)
    expect(response.body.error.code).toBe('unauthenticated')
  })

  it('throttles wrong codes like passwords: 429 after the limit, for that account and address', async () => {
    const limits = { perAccount: 3, perAddress: 100, windowMinutes: 15, delayMaxSeconds: 1 }
    const limited = createApp({
      db,
      config: testConfig({ loginLimits: limits }),
      clientDir: '/nonexistent',
    })
    const failures = async () =>
      (await eventsOf('second_factor.failed').where({ actorId: person.id })).length
    const before = await failures()
    const session = new ApiSession(limited)
    await session.signInWithPasswordOnly(person.email, person.password)
    const statuses: number[] = []
    for (let attempt = 0; attempt < 4; attempt++) {
      statuses.push((await session.post('/api/auth/second-factor', { code: '000000' })).status)
    }
    expect(statuses).toEqual([401, 401, 401, 429])
    await forgetLastCode(person.id)
    const right = await session.post('/api/auth/second-factor', { code: totpCode(secret) })
    expect(right.status).toBe(429)
    expect((await failures()) - before).toBe(3)
    expect((await eventsOf('sign_in.throttled').where({ email: person.email })).length).toBe(2)
  })

  it('can be reset by an administrator (recorded); the person sets up a new one', async () => {
    const other = await makePerson(db, ['reviewer'])
    await admin.post(`/api/people/${other.id}/reset-second-factor`).expect(200)
    expect(await secretOf(other.id)).toBeNull()
    expect(await db('recovery_codes').where({ userId: other.id })).toHaveLength(0)
    const rows = await eventsOf('second_factor.removed')
    expect(detailsOf(rows.at(-1))).toEqual({ personId: other.id })
    const session = await signedIn(app, other.email, other.password)
    expect((await session.get('/api/cases')).body.error.code).toBe('second_factor_setup_required')
    const notAdmin = await signedIn(app, person.email, person.password)
    await notAdmin.post(`/api/people/${other.id}/reset-second-factor`).expect(403)
  })
})
