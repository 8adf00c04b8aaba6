import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson } from '../factories'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let first: ApiSession
let second: ApiSession
let organisationId: number
let keyCount = 0

beforeAll(async () => {
  await resetDatabase(db)
  organisationId = await makeOrganisation(db, 'Linden Cranes')
  const [one, two] = [await makePerson(db, ['investigator']), await makePerson(db, ['admin'])]
  first = await signedIn(app, one.email, one.password)
  second = await signedIn(app, two.email, two.password)
})
afterAll(() => db.destroy())

const newKey = () => `test-key-${process.pid}-${++keyCount}`
const newCase = (title = 'Sheared coupling bolt') => ({
  title,
  organisationId,
  component: 'Coupling bolt',
  material: 'ISO 898-1 property class 10.9',
})

function create(session: ApiSession, key: string | undefined, body: object = newCase()) {
  const sent = session.agent.post('/api/cases').set('X-CSRF-Token', session.token)
  return (key === undefined ? sent : sent.set('Idempotency-Key', key)).send(body)
}

async function counts() {
  const count = async (table: string) =>
    Number((await db(table).count({ count: '*' }))[0]?.count ?? 0)
  return { cases: await count('cases'), activity: await count('audit_events') }
}

describe('POST /api/cases with an Idempotency-Key', () => {
  it('makes one case for the same create sent twice, and answers both alike', async () => {
    const before = await counts()
    const key = newKey()
    const once = await create(first, key).expect(201)
    const again = await create(first, key).expect(201)
    expect(again.body).toEqual(once.body)
    expect(again.headers['idempotent-replayed']).toBe('true')
    expect(once.headers['idempotent-replayed']).toBeUndefined()
    expect(await counts()).toEqual({ cases: before.cases + 1, activity: before.activity + 1 })
  })

  it('makes one case for a double click: the same request several times at once', async () => {
    const before = await counts()
    const key = newKey()
    const answers = await Promise.all(Array.from({ length: 4 }, () => create(first, key)))
    expect(answers.map((answer) => answer.status)).toEqual([201, 201, 201, 201])
    expect(new Set(answers.map((answer) => JSON.stringify(answer.body))).size).toBe(1)
    expect(await counts()).toEqual({ cases: before.cases + 1, activity: before.activity + 1 })
  })

  it('refuses the same key with a different body with 422 idempotency_key_reused', async () => {
    const key = newKey()
    await create(first, key).expect(201)
    const before = await counts()
    const other = await create(first, key, newCase('A different failure')).expect(422)
    expect(other.body.error).toEqual({
      code: 'idempotency_key_reused',
      message: 'This Idempotency-Key was already used for a different request. Send a new key.',
    })
    expect(await counts()).toEqual(before)
  })

  it('keeps keys apart per person', async () => {
    const before = await counts()
    const key = newKey()
    const mine = await create(first, key).expect(201)
    const theirs = await create(second, key).expect(201)
    expect(theirs.body.data.id).not.toBe(mine.body.data.id)
    expect((await counts()).cases).toBe(before.cases + 2)
  })

  it('forgets a key after 24 hours', async () => {
    const key = newKey()
    const once = await create(first, key).expect(201)
    const dayAndHourAgo = new Date(Date.now() - 25 * 3_600_000)
    await db('idempotency_keys').where({ clientKey: key }).update({ createdAt: dayAndHourAgo })
    const later = await create(first, key).expect(201)
    expect(later.body.data.id).not.toBe(once.body.data.id)
    const kept = await db('idempotency_keys').where({ clientKey: key }).select('createdAt')
    expect(kept).toHaveLength(1)
  })

  it('keeps nothing for a refused request, so the corrected one may use the same key', async () => {
    const before = await counts()
    const key = newKey()
    const refused = await create(first, key, { ...newCase(), organisationId: 987_654 }).expect(400)
    expect(refused.body.error.code).toBe('validation_failed')
    expect(await db('idempotency_keys').where({ clientKey: key })).toHaveLength(0)
    await create(first, key).expect(201)
    expect((await counts()).cases).toBe(before.cases + 1)
  })

  it('refuses a malformed key, naming the header, and writes nothing', async () => {
    const before = await counts()
    for (const key of ['', 'has space', 'x'.repeat(192), 'clé']) {
      const response = await create(first, key)
      expect(response.status, key).toBe(400)
      expect(response.body.error.details[0].path).toBe('Idempotency-Key')
    }
    expect(await counts()).toEqual(before)
  })

  it('without a key, makes a case for every request as before', async () => {
    const before = await counts()
    await create(first, undefined).expect(201)
    await create(first, undefined).expect(201)
    expect((await counts()).cases).toBe(before.cases + 2)
  })
})
