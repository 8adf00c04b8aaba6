import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let investigator: TestPerson

beforeAll(async () => {
  await resetDatabase(db)
  investigator = await makePerson(db, ['investigator'])
})
afterAll(() => db.destroy())

const sessionCookie = (response: request.Response) =>
  ([] as string[])
    .concat(response.headers['set-cookie'] ?? [])
    .find((cookie) => cookie.startsWith('fractolog.sid='))

describe('sign-in', () => {
  it('answers the person with roles and organisation', async () => {
    const session = new ApiSession(app)
    const response = await session.signIn(investigator.email, investigator.password)
    expect(response.status).toBe(200)
    expect(response.body.data.user).toMatchObject({
      id: investigator.id,
      email: investigator.email,
      roles: ['investigator'],
      organisationId: null,
      mustChangePassword: false,
    })
    const me = await session.get('/api/auth/me').expect(200)
    expect(me.body.data.user.id).toBe(investigator.id)
  })

  it('accepts the e-mail address in any letter case', async () => {
    const session = new ApiSession(app)
    const response = await session.signIn(investigator.email.toUpperCase(), investigator.password)
    expect(response.status).toBe(200)
  })

  it('gives the same 401 for an unknown e-mail and a wrong password', async () => {
    const wrongPassword = await new ApiSession(app).signIn(investigator.email, 'not the password')
    const unknownEmail = await new ApiSession(app).signIn('nobody@example.test', 'whatever12345')
    expect(wrongPassword.status).toBe(401)
    expect(unknownEmail.status).toBe(401)
    expect(wrongPassword.body.error).toEqual(unknownEmail.body.error)
    expect(wrongPassword.body.error.code).toBe('invalid_credentials')
  })

  it('issues a new session id at sign-in', async () => {
    const session = new ApiSession(app)
    const before = sessionCookie(await session.agent.get('/api/auth/csrf'))
    session.token = (await session.agent.get('/api/auth/csrf')).body.data.token
    const login = await session.post('/api/auth/login', {
      email: investigator.email,
      password: investigator.password,
    })
    const after = sessionCookie(login)
    expect(before).toBeDefined()
    expect(after).toBeDefined()
    expect(after?.split(';')[0]).not.toBe(before?.split(';')[0])
  })

  it('sets an HttpOnly, SameSite=Lax cookie that expires after the idle time', async () => {
    const session = new ApiSession(app)
    const login = await session.signIn(investigator.email, investigator.password)
    const cookie = sessionCookie(login) ?? ''
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    const expires = new Date(/Expires=([^;]+)/.exec(cookie)?.[1] ?? '').getTime()
    expect(expires - Date.now()).toBeGreaterThan(29 * 60_000)
    expect(expires - Date.now()).toBeLessThanOrEqual(30 * 60_000 + 1000)
  })

  it('refuses a sign-in without the CSRF token with 403', async () => {
    const response = await request(app)
      .post('/api/auth/login')
      .send({ email: investigator.email, password: investigator.password })
      .expect(403)
    expect(response.body.error.code).toBe('csrf_invalid')
  })

  it('refuses a wrong CSRF token with 403', async () => {
    const session = new ApiSession(app)
    await session.refreshToken()
    session.token = 'forged-token'
    const response = await session.post('/api/auth/login', {
      email: investigator.email,
      password: investigator.password,
    })
    expect(response.status).toBe(403)
  })

  it('answers bad input with 400 and a clear message', async () => {
    const session = new ApiSession(app)
    await session.refreshToken()
    const missing = await session.post('/api/auth/login', { email: investigator.email })
    expect(missing.status).toBe(400)
    expect(missing.body.error.message).toMatch(/password/i)
    const unknown = await session.post('/api/auth/login', {
      email: investigator.email,
      password: 'x',
      admin: true,
    })
    expect(unknown.status).toBe(400)
    const wrongType = await session.post('/api/auth/login', { email: 42, password: 'x' })
    expect(wrongType.status).toBe(400)
  })
})

describe('rate limit on sign-in', () => {
  it('answers 429 after too many failures for one account, even from fresh sessions', async () => {
    const limited = createApp({
      db,
      config: testConfig({
        loginLimits: { perAccount: 3, perAddress: 100, windowMinutes: 15, delayMaxSeconds: 1 },
      }),
      clientDir: '/nonexistent',
    })
    const person = await makePerson(db, ['lab'])
    const statuses: number[] = []
    for (let attempt = 0; attempt < 4; attempt++) {
      statuses.push((await new ApiSession(limited).signIn(person.email, 'wrong password!')).status)
    }
    expect(statuses).toEqual([401, 401, 401, 429])
    const correct = await new ApiSession(limited).signIn(person.email, person.password)
    expect(correct.status).toBe(429)
    const other = await new ApiSession(limited).signIn(investigator.email, investigator.password)
    expect(other.status).toBe(200)
  })

  it('answers 429 after too many failures from one address across accounts', async () => {
    const limited = createApp({
      db,
      config: testConfig({
        loginLimits: { perAccount: 100, perAddress: 2, windowMinutes: 15, delayMaxSeconds: 1 },
      }),
      clientDir: '/nonexistent',
    })
    const first = await new ApiSession(limited).signIn('a@example.test', 'wrong password!')
    const second = await new ApiSession(limited).signIn('b@example.test', 'wrong password!')
    const third = await new ApiSession(limited).signIn('c@example.test', 'wrong password!')
    expect([first.status, second.status, third.status]).toEqual([401, 401, 429])
    expect(third.body.error.code).toBe('too_many_requests')
  })
})

describe('sign-out and session end', () => {
  it('ends the session: the old cookie no longer works', async () => {
    const session = await signedIn(app, investigator.email, investigator.password)
    await session.post('/api/auth/logout').expect(204)
    expect(await session.signedInId()).toBeNull()
    await session.get('/api/cases').expect(401)
  })

  it('answers signed-out calls with 401', async () => {
    for (const path of ['/api/cases', '/api/people', '/api/organisations', '/api/staff']) {
      const response = await request(app).get(path)
      expect(response.status, path).toBe(401)
      expect(response.body.error.code).toBe('unauthenticated')
    }
  })

  it('tells a signed-out visitor that nobody is signed in, without an error status', async () => {
    const response = await request(app).get('/api/auth/me')
    expect(response.status).toBe(200)
    expect(response.body).toEqual({ data: { user: null } })
  })

  it('refuses a deactivated person and ends their open sessions', async () => {
    const organisationId = await makeOrganisation(db)
    const admin = await makePerson(db, ['admin'])
    const leaving = await makePerson(db, ['client'], { organisationId })
    const theirSession = await signedIn(app, leaving.email, leaving.password)
    expect(await theirSession.signedInId()).toBe(leaving.id)
    const adminSession = await signedIn(app, admin.email, admin.password)
    await adminSession
      .put(`/api/people/${leaving.id}`, {
        email: leaving.email,
        name: 'Leaving client',
        roles: ['client'],
        organisationId,
        active: false,
      })
      .expect(200)
    expect(await theirSession.signedInId()).toBeNull()
    const again = await new ApiSession(app).signIn(leaving.email, leaving.password)
    expect(again.status).toBe(401)
  })
})

describe('session lifetime', () => {
  it('ends a session older than the absolute lifetime, however active', async () => {
    const session = await signedIn(app, investigator.email, investigator.password)
    expect(await session.signedInId()).toBe(investigator.id)
    const thirteenHoursAgo = Date.now() - 13 * 3_600_000
    const rows = (await db('sessions').select('sid', 'sess')) as { sid: string; sess: unknown }[]
    const stored = (value: unknown) =>
      (typeof value === 'string' ? JSON.parse(value) : value) as { passport?: { user?: number } }
    const mine = rows.filter((row) => stored(row.sess).passport?.user === investigator.id)
    expect(mine.length).toBeGreaterThan(0)
    for (const row of mine) {
      const sess = { ...stored(row.sess), signedInAt: thirteenHoursAgo }
      await db('sessions')
        .where({ sid: row.sid })
        .update({ sess: JSON.stringify(sess) })
    }
    expect(await session.signedInId()).toBeNull()
    await session.get('/api/cases').expect(401)
  })

  it('marks the cookie Secure in production behind an HTTPS proxy', async () => {
    const production = createApp({
      db,
      config: testConfig({ nodeEnv: 'production' }),
      clientDir: '/nonexistent',
    })
    const response = await request(production)
      .get('/api/auth/csrf')
      .set('X-Forwarded-Proto', 'https')
      .expect(200)
    const cookie = ([] as string[])
      .concat(response.headers['set-cookie'] ?? [])
      .find((line) => line.startsWith('__Host-fractolog.sid='))
    expect(cookie).toMatch(/;\s*Secure/i)
    expect(cookie).toMatch(/;\s*Path=\/(;|$)/i)
    expect(cookie).not.toMatch(/Domain=/i)
  })
})

describe('first password', () => {
  it('keeps someone with a one-time password to changing it, then lets them work', async () => {
    const person = await makePerson(db, ['reviewer'], { mustChangePassword: true })
    const session = await signedIn(app, person.email, person.password)
    const blocked = await session.get('/api/cases')
    expect(blocked.status).toBe(403)
    expect(blocked.body.error.code).toBe('password_change_required')
    const tooShort = await session.post('/api/auth/password', {
      currentPassword: person.password,
      newPassword: 'short',
    })
    expect(tooShort.status).toBe(400)
    const wrongCurrent = await session.post('/api/auth/password', {
      currentPassword: 'not it at all',
      newPassword: 'a brand new passphrase',
    })
    expect(wrongCurrent.status).toBe(400)
    const changed = await session.post('/api/auth/password', {
      currentPassword: person.password,
      newPassword: 'a brand new passphrase',
    })
    expect(changed.status).toBe(200)
    expect(changed.body.data.user.mustChangePassword).toBe(false)
    await session.get('/api/cases').expect(200)
    const fresh = await new ApiSession(app).signIn(person.email, 'a brand new passphrase')
    expect(fresh.status).toBe(200)
  })
})
