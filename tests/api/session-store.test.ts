import { afterAll, describe, expect, it } from 'vitest'
import { SessionStore } from '../../server/auth/session-store'
import { createTestDb } from '../helpers/test-db'

const db = createTestDb()
afterAll(() => db.destroy())

const sid = (name: string) => `store-test-${process.pid}-${name}`
const pause = (ms: number) => new Promise((done) => setTimeout(done, ms))

describe('the session store', () => {
  it('keeps a session it stored and reads it back', async () => {
    const store = new SessionStore({ db, cleanupMs: 0, log: () => undefined })
    const session = { cookie: { originalMaxAge: 60_000, expires: new Date(Date.now() + 60_000) } }
    await new Promise<void>((done, fail) =>
      store.set(sid('kept'), session as never, (error) => (error ? fail(error) : done())),
    )
    const read = await new Promise((done) => store.get(sid('kept'), (_error, value) => done(value)))
    expect(read).toMatchObject({ cookie: { originalMaxAge: 60_000 } })
  })

  it('deletes expired sessions on its own schedule and keeps the others', async () => {
    const past = new Date(Date.now() - 60_000)
    const future = new Date(Date.now() + 3_600_000)
    await db('sessions').insert([
      { sid: sid('expired'), sess: JSON.stringify({ cookie: {} }), expired: past },
      { sid: sid('current'), sess: JSON.stringify({ cookie: {} }), expired: future },
    ])
    const store = new SessionStore({ db, cleanupMs: 50, log: () => undefined })
    try {
      const deadline = Date.now() + 5_000
      while (Date.now() < deadline) {
        if (
          !(await db('sessions')
            .where({ sid: sid('expired') })
            .first())
        )
          break
        await pause(50)
      }
      expect(
        await db('sessions')
          .where({ sid: sid('expired') })
          .first(),
      ).toBeUndefined()
      expect(
        await db('sessions')
          .where({ sid: sid('current') })
          .first(),
      ).toBeDefined()
    } finally {
      store.close()
    }
  })
})
