import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let admin: ApiSession

beforeAll(async () => {
  await resetDatabase(db)
  const adminPerson = await makePerson(db, ['admin'])
  admin = await signedIn(app, adminPerson.email, adminPerson.password)
})
afterAll(() => db.destroy())

/** The raw session cookie the browser holds, as a thief would copy it. */
async function stolenCookie(session: ApiSession): Promise<string> {
  const response = await session.get('/api/auth/csrf')
  const fromAnswer = ([] as string[]).concat(response.headers['set-cookie'] ?? [])
  const jar = session.agent.jar.getCookie('fractolog.sid', {
    domain: '127.0.0.1',
    path: '/',
    secure: false,
    script: false,
  })
  const value = jar?.value ?? fromAnswer[0]?.split(';')[0]?.split('=').slice(1).join('=')
  if (!value) throw new Error('no session cookie')
  return `fractolog.sid=${value}`
}

/** Replays the cookie against the case list without any client that could forget it. */
const replay = (cookie: string) => request(app).get('/api/cases').set('Cookie', cookie)

async function signedInWithCookie(person: TestPerson) {
  const session = await signedIn(app, person.email, person.password)
  const cookie = await stolenCookie(session)
  expect((await replay(cookie)).status).toBe(200)
  return { session, cookie }
}

describe('an old session cookie opens nothing', () => {
  it('after signing out', async () => {
    const person = await makePerson(db, ['investigator'])
    const { session, cookie } = await signedInWithCookie(person)
    await session.post('/api/auth/logout').expect(204)
    expect((await replay(cookie)).status).toBe(401)
  })

  it('after changing one’s own password: every other session ends, this one gets a new id', async () => {
    const person = await makePerson(db, ['investigator'])
    const { cookie: elsewhere } = await signedInWithCookie(person)
    const { session, cookie: here } = await signedInWithCookie(person)
    const changed = await session.post('/api/auth/password', {
      currentPassword: person.password,
      newPassword: 'quench cracks along the fillet',
    })
    expect(changed.status).toBe(200)
    expect((await replay(elsewhere)).status).toBe(401)
    expect((await replay(here)).status).toBe(401)
    // the session itself goes on under its new id, with its security token
    await session.get('/api/cases').expect(200)
    expect(await stolenCookie(session)).not.toBe(here)
    await session.post('/api/auth/logout').expect(204)
  })

  it('after an administrator resets the password', async () => {
    const person = await makePerson(db, ['lab'])
    const { cookie } = await signedInWithCookie(person)
    await admin.post(`/api/people/${person.id}/reset-password`).expect(200)
    expect((await replay(cookie)).status).toBe(401)
  })

  it('after deactivation', async () => {
    const organisationId = await makeOrganisation(db)
    const person = await makePerson(db, ['client'], { organisationId })
    const { cookie } = await signedInWithCookie(person)
    const update = { email: person.email, name: 'Gone', roles: ['client'], organisationId }
    await admin.put(`/api/people/${person.id}`, { ...update, active: false }).expect(200)
    expect((await replay(cookie)).status).toBe(401)
  })

  it('after the idle expiry and after the absolute lifetime', async () => {
    const person = await makePerson(db, ['reviewer'])
    const idle = await signedInWithCookie(person)
    const old = await signedInWithCookie(person)
    const sid = (cookie: string) => decodeURIComponent(cookie.split('=')[1]!).slice(2).split('.')[0]
    await db('sessions')
      .where({ sid: sid(idle.cookie) })
      .update({ expired: new Date(Date.now() - 1000) })
    const row = await db('sessions')
      .where({ sid: sid(old.cookie) })
      .first()
    const stored = typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess
    const lifetimeAgo = Date.now() - 13 * 3_600_000
    await db('sessions')
      .where({ sid: sid(old.cookie) })
      .update({ sess: JSON.stringify({ ...stored, signedInAt: lifetimeAgo }) })
    expect((await replay(idle.cookie)).status).toBe(401)
    expect((await replay(old.cookie)).status).toBe(401)
  })
})

describe('one-time passwords', () => {
  it('expire: an expired one is refused with a clear message, and the admin can issue another', async () => {
    const created = await admin
      .post('/api/people', { email: 'late.starter@example.test', name: 'Late', roles: ['lab'] })
      .expect(201)
    const { person, oneTimePassword } = created.body.data
    const expires = await db('users').where({ id: person.id }).first('oneTimePasswordExpiresAt')
    const hours = (expires.oneTimePasswordExpiresAt.getTime() - Date.now()) / 3_600_000
    expect(hours).toBeGreaterThan(71.9)
    expect(hours).toBeLessThanOrEqual(72)
    await db('users')
      .where({ id: person.id })
      .update({ oneTimePasswordExpiresAt: new Date(Date.now() - 1000) })
    const refused = await new ApiSession(app).signIn('late.starter@example.test', oneTimePassword)
    expect(refused.status).toBe(401)
    expect(refused.body.error.code).toBe('one_time_password_expired')
    expect(refused.body.error.message).toMatch(/expired.*administrator/)
    const reissued = await admin.post(`/api/people/${person.id}/reset-password`).expect(200)
    const login = await new ApiSession(app).signIn(
      'late.starter@example.test',
      reissued.body.data.oneTimePassword,
    )
    expect(login.status).toBe(200)
    expect(login.body.data.user.mustChangePassword).toBe(true)
  })

  it('a wrong password for an expired one is refused like any wrong password', async () => {
    const person = await makePerson(db, ['lab'], { mustChangePassword: true })
    await db('users')
      .where({ id: person.id })
      .update({ oneTimePasswordExpiresAt: new Date(Date.now() - 1000) })
    const wrong = await new ApiSession(app).signIn(person.email, 'not the password at all')
    expect(wrong.body.error.code).toBe('invalid_credentials')
  })
})

describe('new passwords', () => {
  it('are refused when among the common or breached ones (the @zxcvbn-ts/language-common list)', async () => {
    const person = await makePerson(db, ['investigator'])
    const session = await signedIn(app, person.email, person.password)
    // "password1234" and "qwertyuiop123" are entries of that package's passwords list
    for (const newPassword of ['password1234', 'QwertyUiop123']) {
      const refused = await session.post('/api/auth/password', {
        currentPassword: person.password,
        newPassword,
      })
      expect(refused.status, newPassword).toBe(400)
      expect(refused.body.error.details[0].path).toBe('newPassword')
    }
  })
})
