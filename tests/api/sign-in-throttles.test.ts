import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import type { Config } from '../../server/config'
import { makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
let owner: TestPerson

beforeAll(async () => {
  await resetDatabase(db)
  owner = await makePerson(db, ['investigator'])
})
afterAll(() => db.destroy())

// documentation addresses (RFC 5737), sent by the loopback "proxy" the tests speak through
const OWNER_ADDRESS = '192.0.2.10'
const STRANGER_ADDRESS = '198.51.100.7'

function limitedApp(overrides: Partial<Config> = {}) {
  return createApp({ db, config: testConfig(overrides), clientDir: '/nonexistent' })
}

/** A session whose requests come from `address`, as a trusted proxy reports it. */
function from(app: ReturnType<typeof limitedApp>, address: string): ApiSession {
  const session = new ApiSession(app)
  session.agent.set('X-Forwarded-For', address)
  return session
}

describe('sign-in throttles without lock-out', () => {
  const limits = { perAccount: 3, perAddress: 100, windowMinutes: 15, delayMaxSeconds: 1 }

  it('a stranger’s wrong passwords from elsewhere do not lock the owner out', async () => {
    const app = limitedApp({ loginLimits: limits })
    const statuses: number[] = []
    for (let attempt = 0; attempt < 6; attempt++) {
      statuses.push(
        (await from(app, STRANGER_ADDRESS).signIn(owner.email, 'guess ' + attempt)).status,
      )
    }
    expect(statuses).toEqual([401, 401, 401, 429, 429, 429])
    const started = Date.now()
    const own = await from(app, OWNER_ADDRESS).signIn(owner.email, owner.password)
    expect(own.status).toBe(200)
    // the account is slowed down, never blocked: here at most delayMaxSeconds (1 s) per step
    expect(Date.now() - started).toBeLessThan(10_000)
  })

  it('still refuses one address that tries many accounts', async () => {
    const app = limitedApp({ loginLimits: { ...limits, perAccount: 100, perAddress: 2 } })
    const statuses = []
    for (const email of ['a@example.test', 'b@example.test', 'c@example.test']) {
      statuses.push((await from(app, STRANGER_ADDRESS).signIn(email, 'wrong password!')).status)
    }
    expect(statuses).toEqual([401, 401, 429])
    const elsewhere = await from(app, OWNER_ADDRESS).signIn(owner.email, owner.password)
    expect(elsewhere.status).toBe(200)
  })

  it('slows an account under attack from many addresses down, growing with each failure', async () => {
    const app = limitedApp({ loginLimits: { ...limits, perAccount: 100, delayMaxSeconds: 2 } })
    const durations: number[] = []
    for (let attempt = 0; attempt < 6; attempt++) {
      const started = Date.now()
      await from(app, `203.0.113.${attempt + 1}`).signIn(owner.email, 'wrong password!')
      durations.push(Date.now() - started)
    }
    // three free failures, then 250 ms, 500 ms, 1 s (server/auth/sign-in-throttle.ts)
    const free = Math.min(...durations.slice(0, 3))
    expect(durations[4]!).toBeGreaterThan(free + 400)
    expect(durations[5]!).toBeGreaterThan(free + 900)
  })

  it('takes the client address from X-Forwarded-For only when a trusted proxy sent it', async () => {
    const app = limitedApp({ loginLimits: { ...limits, perAddress: 2 }, trustProxy: false })
    for (const address of ['192.0.2.1', '192.0.2.2']) {
      await from(app, address).signIn('x@example.test', 'wrong password!')
    }
    // without a trusted proxy the header is ignored: all came from the one real address
    const third = await from(app, '192.0.2.3').signIn('y@example.test', 'wrong password!')
    expect(third.status).toBe(429)
  })

  it('checks unknown and inactive addresses against a dummy hash: they take as long', async () => {
    const app = limitedApp({ passwordCost: 14 })
    const inactive = await makePerson(db, ['lab'], { active: false })
    const timeOf = async (email: string) => {
      const started = performance.now()
      await from(app, `203.0.113.${Math.floor(Math.random() * 200) + 20}`).signIn(
        email,
        'wrong password!',
      )
      return performance.now() - started
    }
    await timeOf('warm-up@example.test')
    const median = async (email: string) => {
      const times = []
      for (let run = 0; run < 3; run++) times.push(await timeOf(email))
      return times.sort((a, b) => a - b)[1]!
    }
    // the stored hashes cost 2^10 (factories); the dummy costs the configured 2^14, as real
    // passwords made at that cost would: an unknown address must not answer faster than them
    const unknown = await median('nobody-at-all@example.test')
    const notActive = await median(inactive.email)
    const scrypt14 = await (async () => {
      const { hashPassword } = await import('../../server/auth/passwords')
      const started = performance.now()
      await hashPassword('x', 14)
      return performance.now() - started
    })()
    expect(unknown).toBeGreaterThan(scrypt14 * 0.5)
    expect(notActive).toBeGreaterThan(scrypt14 * 0.5)
  })
})

describe('other limits', () => {
  it('limits password changes per session', async () => {
    const app = limitedApp({ passwordChangeLimit: 2 })
    const session = await signedIn(app, owner.email, owner.password)
    const statuses = []
    for (let attempt = 0; attempt < 3; attempt++) {
      const body = { currentPassword: 'not the current one', newPassword: 'a long new passphrase' }
      statuses.push((await session.post('/api/auth/password', body)).status)
    }
    expect(statuses).toEqual([400, 400, 429])
    const rows = await db('security_events').where({
      kind: 'password.throttled',
      actorId: owner.id,
    })
    expect(rows).toHaveLength(1)
  })

  it('limits security-token requests per address', async () => {
    const app = limitedApp({ csrfLimitPerAddress: 3 })
    const statuses = []
    for (let attempt = 0; attempt < 4; attempt++) {
      statuses.push(
        (await request(app).get('/api/auth/csrf').set('X-Forwarded-For', STRANGER_ADDRESS)).status,
      )
    }
    expect(statuses).toEqual([200, 200, 200, 429])
    const other = await request(app).get('/api/auth/csrf').set('X-Forwarded-For', OWNER_ADDRESS)
    expect(other.status).toBe(200)
  })
})
