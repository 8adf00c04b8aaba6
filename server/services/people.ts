import type { Knex } from 'knex'
import type { SessionUser } from '../../shared/schemas/auth'
import type { Person, PersonCreate, PersonUpdate } from '../../shared/schemas/people'
import type { Role } from '../../shared/schemas/roles'
import { withDbErrors } from '../db/errors'
import { NotFound, ValidationError } from '../errors'
import { generateOneTimePassword, hashPassword, verifyPassword } from '../auth/passwords'
import { recordAudit } from './audit'

interface UserRow {
  id: number
  email: string
  name: string
  passwordHash: string
  mustChangePassword: number | boolean
  active: number | boolean
  organisationId: number | null
  lastSignInAt: Date | null
  createdAt: Date
}

const DUPLICATE_EMAIL = {
  index: 'users_email_unique',
  message: 'A person with this e-mail address already exists.',
}

async function rolesOf(db: Knex, userIds: number[]): Promise<Map<number, Role[]>> {
  const rows = (await db('user_roles').whereIn('userId', userIds).orderBy('role')) as {
    userId: number
    role: Role
  }[]
  const byUser = new Map<number, Role[]>()
  for (const row of rows) byUser.set(row.userId, [...(byUser.get(row.userId) ?? []), row.role])
  return byUser
}

function toPerson(row: UserRow, roles: Role[]): Person {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    roles,
    organisationId: row.organisationId,
    active: Boolean(row.active),
    mustChangePassword: Boolean(row.mustChangePassword),
    lastSignInAt: row.lastSignInAt ? row.lastSignInAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
  }
}

export function toSessionUser(person: Person): SessionUser {
  const { id, email, name, roles, organisationId, mustChangePassword } = person
  return { id, email, name, roles, organisationId, mustChangePassword }
}

async function requireOrganisation(db: Knex, organisationId: number | null): Promise<void> {
  if (organisationId === null) return
  const found = await db('organisations').where({ id: organisationId }).first('id')
  if (!found) throw new ValidationError('The client organisation does not exist.')
}

export function createPeopleService(db: Knex, options: { passwordCost: number }) {
  async function find(id: number): Promise<Person | undefined> {
    const row = (await db('users').where({ id }).first()) as UserRow | undefined
    if (!row) return undefined
    return toPerson(row, (await rolesOf(db, [id])).get(id) ?? [])
  }

  async function get(id: number): Promise<Person> {
    const person = await find(id)
    if (!person) throw new NotFound('No such person.')
    return person
  }

  async function list(): Promise<Person[]> {
    const rows = (await db('users').orderBy('name')) as UserRow[]
    const roles = await rolesOf(
      db,
      rows.map((row) => row.id),
    )
    return rows.map((row) => toPerson(row, roles.get(row.id) ?? []))
  }

  /** Active staff, for choosing who leads or reviews a case. */
  async function listStaff(): Promise<{ id: number; name: string; roles: Role[] }[]> {
    const people = await list()
    return people
      .filter((person) => person.active && !person.roles.includes('client'))
      .map(({ id, name, roles }) => ({ id, name, roles }))
  }

  /** The person behind an e-mail and password, or undefined: the caller answers generically. */
  async function verifyCredentials(email: string, password: string): Promise<Person | undefined> {
    const row = (await db('users').where({ email }).first()) as UserRow | undefined
    if (!row || !row.active || !(await verifyPassword(password, row.passwordHash))) return undefined
    await db('users').where({ id: row.id }).update({ lastSignInAt: new Date() })
    return get(row.id)
  }

  async function create(input: PersonCreate, actorId: number) {
    await requireOrganisation(db, input.organisationId)
    const oneTimePassword = generateOneTimePassword()
    const passwordHash = await hashPassword(oneTimePassword, options.passwordCost)
    const id = await withDbErrors(
      () =>
        db.transaction(async (trx) => {
          const [newId] = (await trx('users').insert({
            email: input.email,
            name: input.name,
            organisationId: input.organisationId,
            passwordHash,
            mustChangePassword: true,
          })) as number[]
          await trx('user_roles').insert(input.roles.map((role) => ({ userId: newId, role })))
          await recordAudit(trx, {
            actorId,
            kind: 'person.created',
            details: { personId: newId },
          })
          return newId as number
        }),
      DUPLICATE_EMAIL,
    )
    return { person: await get(id), oneTimePassword }
  }

  async function update(id: number, input: PersonUpdate, actorId: number): Promise<Person> {
    await get(id)
    await requireOrganisation(db, input.organisationId)
    if (id === actorId && (!input.active || !input.roles.includes('admin'))) {
      throw new ValidationError('You cannot deactivate yourself or remove your own admin role.')
    }
    await withDbErrors(
      () =>
        db.transaction(async (trx) => {
          const { roles, ...fields } = input
          await trx('users').where({ id }).update(fields)
          await trx('user_roles').where({ userId: id }).delete()
          await trx('user_roles').insert(roles.map((role) => ({ userId: id, role })))
          if (!input.active) await endSessionsOf(trx, id)
          await recordAudit(trx, { actorId, kind: 'person.updated', details: { personId: id } })
        }),
      DUPLICATE_EMAIL,
    )
    return get(id)
  }

  async function resetPassword(id: number, actorId: number) {
    await get(id)
    const oneTimePassword = generateOneTimePassword()
    const passwordHash = await hashPassword(oneTimePassword, options.passwordCost)
    await db.transaction(async (trx) => {
      await trx('users').where({ id }).update({ passwordHash, mustChangePassword: true })
      await endSessionsOf(trx, id)
      await recordAudit(trx, {
        actorId,
        kind: 'person.password_reset',
        details: { personId: id },
      })
    })
    return { person: await get(id), oneTimePassword }
  }

  async function changeOwnPassword(id: number, current: string, next: string): Promise<Person> {
    const row = (await db('users').where({ id }).first()) as UserRow | undefined
    if (!row || !(await verifyPassword(current, row.passwordHash))) {
      throw new ValidationError('The current password is not correct.', [
        { path: 'currentPassword', message: 'The current password is not correct.' },
      ])
    }
    if (current === next) {
      throw new ValidationError('Choose a new password that differs from the current one.', [
        { path: 'newPassword', message: 'Choose a password that differs from the current one.' },
      ])
    }
    const passwordHash = await hashPassword(next, options.passwordCost)
    await db.transaction(async (trx) => {
      await trx('users').where({ id }).update({ passwordHash, mustChangePassword: false })
      await recordAudit(trx, { actorId: id, kind: 'person.password_changed' })
    })
    return get(id)
  }

  return {
    find,
    get,
    list,
    listStaff,
    verifyCredentials,
    create,
    update,
    resetPassword,
    changeOwnPassword,
  }
}

export type PeopleService = ReturnType<typeof createPeopleService>

/** Ends every stored session of one person (deactivation, password reset). */
async function endSessionsOf(trx: Knex, userId: number): Promise<void> {
  await trx('sessions')
    .whereRaw("JSON_VALUE(sess, '$.passport.user') = ?", [String(userId)])
    .delete()
}
