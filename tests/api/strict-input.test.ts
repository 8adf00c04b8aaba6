import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson, type TestPerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

// One regression test per loose reading found by trying the landed API as an operator would:
// each asserts the status, the words of the refusal and that nothing changed.

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let admin: ApiSession
let investigator: ApiSession
let investigatorPerson: TestPerson
let target: TestPerson
let organisationId: number

beforeAll(async () => {
  await resetDatabase(db)
  organisationId = await makeOrganisation(db, 'Hazel Winches')
  const adminPerson = await makePerson(db, ['admin'])
  investigatorPerson = await makePerson(db, ['investigator'])
  target = await makePerson(db, ['lab'])
  admin = await signedIn(app, adminPerson.email, adminPerson.password)
  investigator = await signedIn(app, investigatorPerson.email, investigatorPerson.password)
})
afterAll(() => db.destroy())

/** Everything a refused request could have touched. */
async function snapshot() {
  const count = async (table: string) =>
    Number((await db(table).count({ count: '*' }))[0]?.count ?? 0)
  return {
    users: await db('users').orderBy('id').select('id', 'email', 'passwordHash', 'active'),
    roles: await count('user_roles'),
    sessions: await count('sessions'),
    cases: await db('cases').orderBy('id').select('id', 'version', 'failureDate', 'dueDate'),
    activity: await count('audit_events'),
    organisations: await count('organisations'),
  }
}

const newCase = (overrides: object = {}) => ({
  title: 'Bent hoist hook',
  organisationId,
  component: 'Hoist hook',
  material: 'EN 10083-2 C45',
  ...overrides,
})

const details = (response: { body: { error: { details?: { path: string }[] } } }) =>
  (response.body.error.details ?? []).map((item) => item.path)

describe('ids in the address', () => {
  it('refuses 2%20 instead of resetting the password of person 2', async () => {
    const before = await snapshot()
    const response = await admin.post(`/api/people/${target.id}%20/reset-password`)
    expect(response.status).toBe(400)
    expect(response.body.error).toMatchObject({
      code: 'validation_failed',
      message: 'Invalid URL. id: Use the id of an existing record.',
    })
    expect(details(response)).toEqual(['id'])
    expect(await snapshot()).toEqual(before)
    await new ApiSession(app).signIn(target.email, target.password).then((login) => {
      expect(login.status).toBe(200)
    })
  })

  it('refuses 1e3, 0x10 and every other spelling that is not canonical decimal', async () => {
    const before = await snapshot()
    const spellings = ['1e3', '0x10', '%2B5', '01', '-1', '0', '1.0', '1%2C0', '9999999999999999']
    for (const id of spellings) {
      for (const path of [`/api/cases/${id}`, `/api/people/${id}/reset-password`]) {
        const response = path.startsWith('/api/cases')
          ? await investigator.get(path)
          : await admin.post(path)
        expect(response.status, path).toBe(400)
        expect(response.body.error.code, path).toBe('validation_failed')
        expect(details(response), path).toEqual(['id'])
      }
    }
    expect(await snapshot()).toEqual(before)
  })
})

describe('ids and numbers in the query', () => {
  it('refuses a loose organisation id or page number, naming the parameter', async () => {
    const queries: [string, string][] = [
      [`organisationId=0x${organisationId}`, 'organisationId'],
      [`organisationId=${organisationId}%20`, 'organisationId'],
      [`organisationId=${organisationId}&organisationId=${organisationId}`, 'organisationId'],
      ['page=1e1', 'page'],
      ['pageSize=010', 'pageSize'],
    ]
    for (const [query, field] of queries) {
      const response = await investigator.get(`/api/cases?${query}`)
      expect(response.status, query).toBe(400)
      expect(details(response), query).toEqual([field])
    }
  })
})

describe('ids in the body', () => {
  it('refuses true, [2] and "0x2" where an id belongs, naming the field', async () => {
    const before = await snapshot()
    for (const id of [true, [organisationId], `0x${organisationId}`, `${organisationId} `, 2.5]) {
      const response = await investigator.post('/api/cases', newCase({ organisationId: id }))
      expect(response.status, JSON.stringify(id)).toBe(400)
      expect(response.body.error.message).toBe(
        'Invalid request body. organisationId: Choose the client organisation.',
      )
      expect(details(response)).toEqual(['organisationId'])
    }
    const person = await admin.post('/api/people', {
      email: 'hazel.client@example.test',
      name: 'Hazel Client',
      roles: ['client'],
      organisationId: [organisationId],
    })
    expect(person.status).toBe(400)
    expect(details(person)).toEqual(['organisationId'])
    expect(await snapshot()).toEqual(before)
  })

  it('reads a canonical id given as text or as a number alike', async () => {
    const asText = await investigator.post(
      '/api/cases',
      newCase({ organisationId: `${organisationId}` }),
    )
    expect(asText.status).toBe(201)
    expect(asText.body.data.organisationId).toBe(organisationId)
  })
})

describe('dates', () => {
  it('refuses the year 0050 instead of storing it and reading back 1950', async () => {
    const before = await snapshot()
    const response = await investigator.post('/api/cases', newCase({ failureDate: '0050-06-15' }))
    expect(response.status).toBe(400)
    expect(response.body.error.message).toBe(
      'Invalid request body. failureDate: Use a real date in the form YYYY-MM-DD, between 1800 and 2200.',
    )
    expect(details(response)).toEqual(['failureDate'])
    expect(await snapshot()).toEqual(before)
  })

  it('refuses days that do not exist and dates in other forms', async () => {
    const before = await snapshot()
    for (const dueDate of ['2027-02-29', '2026-13-01', '2026-04-31', '2026-6-5', '2201-01-01']) {
      const response = await investigator.post('/api/cases', newCase({ dueDate }))
      expect(response.status, dueDate).toBe(400)
      expect(details(response), dueDate).toEqual(['dueDate'])
    }
    expect(await snapshot()).toEqual(before)
  })

  it('stores the first and last days of the range and a leap day exactly as sent', async () => {
    const dates = { failureDate: '1800-01-01', receivedOn: '2024-02-29', dueDate: '2200-12-31' }
    const created = await investigator.post('/api/cases', newCase(dates)).expect(201)
    expect(created.body.data).toMatchObject(dates)
    const read = await investigator.get(`/api/cases/${created.body.data.id}`).expect(200)
    expect(read.body.data).toMatchObject(dates)
  })

  it('refuses a due date before the failure date', async () => {
    const before = await snapshot()
    const response = await investigator.post(
      '/api/cases',
      newCase({ failureDate: '2026-01-10', dueDate: '2026-01-05' }),
    )
    expect(response.status).toBe(400)
    expect(response.body.error.details).toEqual([
      { path: 'dueDate', message: 'The due date cannot be before the failure date.' },
    ])
    expect(await snapshot()).toEqual(before)
  })
})

describe('passwords and e-mail addresses', () => {
  it('refuses a new password of twelve spaces and keeps the old one', async () => {
    const person = await makePerson(db, ['lab'])
    const session = await signedIn(app, person.email, person.password)
    const before = await snapshot()
    const response = await session.post('/api/auth/password', {
      currentPassword: person.password,
      newPassword: ' '.repeat(12),
    })
    expect(response.status).toBe(400)
    expect(response.body.error.details).toEqual([
      { path: 'newPassword', message: 'A password cannot be only spaces.' },
    ])
    expect(await snapshot()).toEqual(before)
    expect((await new ApiSession(app).signIn(person.email, person.password)).status).toBe(200)
  })

  it('trims an e-mail address before checking it, when creating a person and signing in', async () => {
    const created = await admin
      .post('/api/people', {
        email: '  Hazel.Lab@Example.test ',
        name: 'Hazel Lab',
        roles: ['lab'],
      })
      .expect(201)
    expect(created.body.data.person.email).toBe('hazel.lab@example.test')
    const login = await new ApiSession(app).signIn(
      '  hazel.lab@example.test  ',
      created.body.data.oneTimePassword as string,
    )
    expect(login.status).toBe(200)
  })
})

describe('lists with duplicates', () => {
  it('refuses a role named twice with its own message, not as a duplicate e-mail', async () => {
    const before = await snapshot()
    const body = { email: 'twice.roles@example.test', name: 'Twice Roles', roles: ['lab', 'lab'] }
    const created = await admin.post('/api/people', body)
    expect(created.status).toBe(400)
    expect(created.body.error.details).toEqual([
      { path: 'roles', message: 'Choose each role only once.' },
    ])
    const update = await admin.put(`/api/people/${target.id}`, {
      email: target.email,
      name: 'Target',
      roles: ['lab', 'reviewer', 'lab'],
      organisationId: null,
      active: true,
    })
    expect(update.status).toBe(400)
    expect(update.body.error.message).not.toMatch(/already exists/)
    expect(details(update)).toEqual(['roles'])
    expect(await snapshot()).toEqual(before)
  })

  it('says a person already exists only for a real duplicate e-mail address', async () => {
    const before = await snapshot()
    const created = await admin.post('/api/people', {
      email: ` ${investigatorPerson.email.toUpperCase()}`,
      name: 'Second Investigator',
      roles: ['investigator'],
    })
    expect(created.status).toBe(409)
    expect(created.body.error).toMatchObject({
      code: 'conflict',
      message: 'A person with this e-mail address already exists.',
    })
    const renamed = await admin.put(`/api/people/${target.id}`, {
      email: investigatorPerson.email,
      name: 'Target',
      roles: ['lab'],
      organisationId: null,
      active: true,
    })
    expect(renamed.status).toBe(409)
    expect(renamed.body.error.message).toBe('A person with this e-mail address already exists.')
    expect(await snapshot()).toEqual(before)
  })

  it('refuses a co-investigator named twice', async () => {
    const before = await snapshot()
    const response = await investigator.post(
      '/api/cases',
      newCase({ coInvestigatorIds: [investigatorPerson.id, investigatorPerson.id] }),
    )
    expect(response.status).toBe(400)
    expect(response.body.error.details).toEqual([
      { path: 'coInvestigatorIds', message: 'Name each co-investigator only once.' },
    ])
    expect(await snapshot()).toEqual(before)
  })
})

describe('request bodies', () => {
  const expectRefusal = async (
    response: { status: number; body: { error: { code: string; message: string } } },
    message: string,
  ) => {
    expect(response.status).toBe(400)
    expect(response.body.error).toEqual({ code: 'validation_failed', message })
  }

  it('says an application/json object is expected when the body is null or another value', async () => {
    const before = await snapshot()
    const sent = (text: string) =>
      investigator.agent
        .post('/api/cases')
        .set('X-CSRF-Token', investigator.token)
        .set('Content-Type', 'application/json')
        .send(text)
    const expected = (what: string) =>
      `The request body must be an application/json object, not ${what}.`
    await expectRefusal(await sent('null'), expected('null'))
    await expectRefusal(await sent('[1, 2]'), expected('an array'))
    await expectRefusal(await sent('"a case"'), expected('a string'))
    await expectRefusal(await sent('42'), expected('a number'))
    await expectRefusal(await sent('true'), expected('a boolean'))
    expect(await snapshot()).toEqual(before)
  })

  it('says a body is needed when there is none', async () => {
    const before = await snapshot()
    const response = await investigator.agent
      .post('/api/cases')
      .set('X-CSRF-Token', investigator.token)
    await expectRefusal(response, 'The request has no body: send an application/json object.')
    expect(await snapshot()).toEqual(before)
  })

  it('names the content type it got when the body is form-encoded or plain text', async () => {
    const before = await snapshot()
    const form = await investigator.agent
      .post('/api/cases')
      .set('X-CSRF-Token', investigator.token)
      .type('form')
      .send({ title: 'Form case', organisationId: String(organisationId) })
    await expectRefusal(
      form,
      'The request body must be an application/json object, not application/x-www-form-urlencoded.',
    )
    const text = await investigator.agent
      .post('/api/cases')
      .set('X-CSRF-Token', investigator.token)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(newCase()))
    await expectRefusal(
      text,
      'The request body must be an application/json object, not text/plain.',
    )
    expect(await snapshot()).toEqual(before)
  })

  it('still says so when the JSON itself is broken', async () => {
    const response = await investigator.agent
      .post('/api/cases')
      .set('X-CSRF-Token', investigator.token)
      .set('Content-Type', 'application/json')
      .send('{"title": ')
    await expectRefusal(
      response,
      'The request body is not valid JSON: send an application/json object.',
    )
  })
})
