import { afterAll, afterEach, describe, expect, it, vi } from 'vitest'
import { createApp } from '../../server/app'
import { TOUCH_INTERVAL_MS } from '../../server/auth/session-store'
import { makePerson } from '../factories'
import { signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

afterEach(() => {
  vi.useRealTimers()
})
afterAll(() => db.destroy())

/** The stored expiry of the person's one session, in ms. */
async function storedExpiry(personId: number): Promise<number> {
  const rows = (await db('sessions').select('sess', 'expired')) as {
    sess: unknown
    expired: Date
  }[]
  const stored = (value: unknown) =>
    (typeof value === 'string' ? JSON.parse(value) : value) as { passport?: { user?: number } }
  const mine = rows.filter((row) => stored(row.sess).passport?.user === personId)
  expect(mine).toHaveLength(1)
  return new Date(mine[0]!.expired).getTime()
}

describe('the stored session expiry', () => {
  it('moves on with use, but at most once a minute', async () => {
    const started = Date.now()
    vi.useFakeTimers({ toFake: ['Date'], now: started })
    const person = await makePerson(db, ['investigator'])
    const session = await signedIn(app, person.email, person.password)
    const afterSignIn = await storedExpiry(person.id)

    vi.setSystemTime(started + 30_000)
    await session.get('/api/cases').expect(200)
    await session.get('/api/cases').expect(200)
    expect(await storedExpiry(person.id)).toBe(afterSignIn)

    vi.setSystemTime(started + TOUCH_INTERVAL_MS + 5_000)
    await session.get('/api/cases').expect(200)
    // the new expiry counts from this request (the column keeps whole seconds)
    const moved = (await storedExpiry(person.id)) - afterSignIn
    expect(moved).toBeGreaterThanOrEqual(TOUCH_INTERVAL_MS + 4_000)
    expect(moved).toBeLessThanOrEqual(TOUCH_INTERVAL_MS + 6_000)
  })
})
