import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let admin: ApiSession
let investigator: ApiSession
let client: ApiSession
let organisationId: number
let otherOrganisationId: number

beforeAll(async () => {
  await resetDatabase(db)
  organisationId = await makeOrganisation(db, 'Gamma Pressings')
  otherOrganisationId = await makeOrganisation(db, 'Delta Valves')
  const adminPerson = await makePerson(db, ['admin'])
  const investigatorPerson = await makePerson(db, ['investigator'])
  const clientPerson = await makePerson(db, ['client'], { organisationId })
  admin = await signedIn(app, adminPerson.email, adminPerson.password)
  investigator = await signedIn(app, investigatorPerson.email, investigatorPerson.password)
  client = await signedIn(app, clientPerson.email, clientPerson.password)
})
afterAll(() => db.destroy())

const countUsers = async () => Number((await db('users').count({ count: '*' }))[0]?.count)

describe('people administration', () => {
  it('creates a person with a one-time password that must be replaced', async () => {
    const response = await admin
      .post('/api/people', {
        email: 'New.Tech@Example.test',
        name: 'New Technician',
        roles: ['lab', 'reviewer'],
      })
      .expect(201)
    const { person, oneTimePassword } = response.body.data
    expect(person).toMatchObject({
      email: 'new.tech@example.test',
      roles: ['lab', 'reviewer'],
      mustChangePassword: true,
      active: true,
    })
    expect(oneTimePassword.length).toBeGreaterThanOrEqual(20)
    const stored = await db('users').where({ id: person.id }).first('passwordHash')
    expect(stored.passwordHash).not.toContain(oneTimePassword)
    const session = new ApiSession(app)
    const login = await session.signIn('new.tech@example.test', oneTimePassword)
    expect(login.body.data.user.mustChangePassword).toBe(true)
  })

  it('lists people without password hashes', async () => {
    const response = await admin.get('/api/people').expect(200)
    expect(response.body.data.length).toBeGreaterThan(2)
    expect(JSON.stringify(response.body)).not.toMatch(/passwordHash|scrypt/)
  })

  it('refuses a duplicate e-mail with 409 and writes nothing', async () => {
    const before = await countUsers()
    const body = { email: 'twice@example.test', name: 'Twice', roles: ['lab'] }
    await admin.post('/api/people', body).expect(201)
    const again = await admin.post('/api/people', body).expect(409)
    expect(again.body.error.message).toMatch(/already exists/)
    expect(await countUsers()).toBe(before + 1)
  })

  it('keeps clients to one organisation and no staff role', async () => {
    const before = await countUsers()
    const mixed = await admin.post('/api/people', {
      email: 'mixed@example.test',
      name: 'Mixed',
      roles: ['client', 'lab'],
      organisationId,
    })
    expect(mixed.status).toBe(400)
    const orphan = await admin.post('/api/people', {
      email: 'orphan@example.test',
      name: 'Orphan',
      roles: ['client'],
    })
    expect(orphan.status).toBe(400)
    expect(orphan.body.error.details[0].path).toBe('organisationId')
    const staffWithOrg = await admin.post('/api/people', {
      email: 'staff@example.test',
      name: 'Staff',
      roles: ['lab'],
      organisationId,
    })
    expect(staffWithOrg.status).toBe(400)
    expect(await countUsers()).toBe(before)
  })

  it('resets a password: old sessions end and the new one-time password works', async () => {
    const person = await makePerson(db, ['lab'])
    const theirs = await signedIn(app, person.email, person.password)
    const reset = await admin.post(`/api/people/${person.id}/reset-password`).expect(200)
    expect(await theirs.signedInId()).toBeNull()
    const login = await new ApiSession(app).signIn(person.email, reset.body.data.oneTimePassword)
    expect(login.status).toBe(200)
    expect(login.body.data.user.mustChangePassword).toBe(true)
  })

  it('is for administrators only', async () => {
    await investigator.get('/api/people').expect(403)
    await client.get('/api/people').expect(403)
    const before = await countUsers()
    await investigator
      .post('/api/people', { email: 'x@example.test', name: 'X', roles: ['admin'] })
      .expect(403)
    expect(await countUsers()).toBe(before)
  })
})

describe('organisations', () => {
  it('lets an administrator create and rename one; a duplicate name is a 409', async () => {
    const created = await admin
      .post('/api/organisations', { name: 'Epsilon Springs', contactEmail: 'qa@epsilon.test' })
      .expect(201)
    expect(created.body.data).toMatchObject({ name: 'Epsilon Springs', active: true })
    const renamed = await admin
      .put(`/api/organisations/${created.body.data.id}`, {
        name: 'Epsilon Springs Works',
        contactName: null,
        contactEmail: null,
        active: false,
      })
      .expect(200)
    expect(renamed.body.data).toMatchObject({ name: 'Epsilon Springs Works', active: false })
    await admin.post('/api/organisations', { name: 'Gamma Pressings' }).expect(409)
  })

  it('shows staff every organisation and a client only their own', async () => {
    const staff = await investigator.get('/api/organisations').expect(200)
    const names = staff.body.data.map((item: { name: string }) => item.name)
    expect(names).toEqual(expect.arrayContaining(['Gamma Pressings', 'Delta Valves']))
    const own = await client.get('/api/organisations').expect(200)
    expect(own.body.data.map((item: { id: number }) => item.id)).toEqual([organisationId])
  })

  it('refuses changes from anyone but an administrator', async () => {
    await investigator.post('/api/organisations', { name: 'Sneaky Ltd' }).expect(403)
    await client
      .put(`/api/organisations/${otherOrganisationId}`, {
        name: 'Taken over',
        contactName: null,
        contactEmail: null,
        active: true,
      })
      .expect(403)
    await admin.post('/api/organisations', { name: '' }).expect(400)
    await admin.post('/api/organisations', { name: 'Fine', website: 'x' }).expect(400)
  })
})

describe('staff directory', () => {
  it('lists active staff for staff and refuses clients', async () => {
    const response = await investigator.get('/api/staff').expect(200)
    expect(
      response.body.data.every((item: { roles: string[] }) => !item.roles.includes('client')),
    ).toBe(true)
    await client.get('/api/staff').expect(403)
  })
})
