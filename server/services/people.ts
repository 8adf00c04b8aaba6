import type { Knex } from 'knex'
import type { SessionUser } from '../../shared/schemas/auth'
import type { Person, PersonCreate, PersonUpdate } from '../../shared/schemas/people'
import type { Role } from '../../shared/schemas/roles'
import { withDbErrors } from '../db/errors'
import { NotFound, ValidationError } from '../errors'
import { generateOneTimePassword, hashPassword, verifyPassword } from '../auth/passwords'
import { recordAudit } from './audit'
import { isCommonPassword } from '../auth/common-passwords'
import { recordSecurityEvent, type SecurityContext } from './security-events'

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
  secondFactorEnrolledAt: Date | null
  oneTimePasswordExpiresAt: Date | null
  organisationRequiresSecondFactor?: number | boolean | null
}

/** A sign-in whose password was right, or why it is refused although it was. */
export type CredentialCheck = { person: Person } | { expired: true } | undefined

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

const isStaff = (roles: Role[]) => roles.some((role) => role !== 'client')

function toPerson(row: UserRow, roles: Role[]): Person {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    roles,
    organisationId: row.organisationId,
    active: Boolean(row.active),
    mustChangePassword: Boolean(row.mustChangePassword),
    secondFactorEnrolled: row.secondFactorEnrolledAt !== null,
    secondFactorRequired: isStaff(roles) || Boolean(row.organisationRequiresSecondFactor),
    lastSignInAt: row.lastSignInAt ? row.lastSignInAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
  }
}

export function toSessionUser(person: Person): SessionUser {
  const { id, email, name, roles, organisationId, mustChangePassword } = person
  const secondFactorEnrolled = person.secondFactorEnrolled
  const secondFactorSetupRequired = person.secondFactorRequired && !secondFactorEnrolled
  return {
    id,
    email,
    name,
    roles,
    organisationId,
    mustChangePassword,
    secondFactorEnrolled,
    secondFactorSetupRequired,
  }
}

/** People with their organisation's second-factor rule beside them. */
function usersWithRule(db: Knex) {
  return db('users')
    .leftJoin('organisations', 'organisations.id', 'users.organisationId')
    .select('users.*', 'organisations.requiresSecondFactor as organisationRequiresSecondFactor')
}

const noTrail = (actorId: number): SecurityContext => ({ actorId, address: null, userAgent: null })

function refuseCommonPassword(password: string): void {
  if (!isCommonPassword(password)) return
  const message = 'This password is among the most common or breached ones. Choose another.'
  throw new ValidationError(message, [{ path: 'newPassword', message }])
}

async function requireOrganisation(db: Knex, organisationId: number | null): Promise<void> {
  if (organisationId === null) return
  const found = await db('organisations').where({ id: organisationId }).first('id')
  if (!found) throw new ValidationError('The client organisation does not exist.')
}

export interface PeopleOptions {
  passwordCost: number
  /** how long an administrator's one-time password stays valid */
  oneTimePasswordHours?: number
}

export function createPeopleService(db: Knex, options: PeopleOptions) {
  const oneTimePasswordMs = (options.oneTimePasswordHours ?? 72) * 3_600_000
  const expiresAt = () => new Date(Date.now() + oneTimePasswordMs)
  // Unknown and inactive addresses are checked against this, so they take as long as a wrong password.
  let dummyHash: Promise<string> | undefined

  /** One statement: it runs on every signed-in request, to reload the person. */
  async function find(id: number): Promise<Person | undefined> {
    const row = (await usersWithRule(db)
      .select(
        db.raw(
          '(SELECT GROUP_CONCAT(role ORDER BY role) FROM user_roles WHERE user_roles.user_id = users.id) AS role_list',
        ),
      )
      .where('users.id', id)
      .first()) as (UserRow & { roleList: string | null }) | undefined
    if (!row) return undefined
    return toPerson(row, row.roleList ? (row.roleList.split(',') as Role[]) : [])
  }

  async function get(id: number): Promise<Person> {
    const person = await find(id)
    if (!person) throw new NotFound('No such person.')
    return person
  }

  async function list(): Promise<Person[]> {
    const rows = (await usersWithRule(db).orderBy('users.name')) as UserRow[]
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
  async function verifyCredentials(email: string, password: string): Promise<CredentialCheck> {
    const row = (await db('users').where({ email }).first()) as UserRow | undefined
    if (!row || !row.active) {
      dummyHash ??= hashPassword('not anybody’s password', options.passwordCost)
      await verifyPassword(password, await dummyHash)
      return undefined
    }
    if (!(await verifyPassword(password, row.passwordHash))) return undefined
    const expiry = row.oneTimePasswordExpiresAt
    if (row.mustChangePassword && expiry && expiry.getTime() < Date.now()) return { expired: true }
    return { person: await get(row.id) }
  }

  /** Notes a completed sign-in. */
  async function signedIn(id: number): Promise<void> {
    await db('users').where({ id }).update({ lastSignInAt: new Date() })
  }

  async function create(input: PersonCreate, actorId: number, trail = noTrail(actorId)) {
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
            oneTimePasswordExpiresAt: expiresAt(),
          })) as number[]
          await trx('user_roles').insert(input.roles.map((role) => ({ userId: newId, role })))
          await recordAudit(trx, {
            actorId,
            kind: 'person.created',
            details: { personId: newId },
          })
          const details = {
            personId: newId,
            roles: input.roles,
            organisationId: input.organisationId,
          }
          await recordSecurityEvent(trx, trail, {
            kind: 'person.created',
            email: input.email,
            details,
          })
          return newId as number
        }),
      DUPLICATE_EMAIL,
    )
    return { person: await get(id), oneTimePassword }
  }

  async function update(
    id: number,
    input: PersonUpdate,
    actorId: number,
    trail = noTrail(actorId),
  ): Promise<Person> {
    const before = await get(id)
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
          for (const event of changesOf(before, input)) await recordSecurityEvent(trx, trail, event)
        }),
      DUPLICATE_EMAIL,
    )
    return get(id)
  }

  async function resetPassword(id: number, actorId: number, trail = noTrail(actorId)) {
    const person = await get(id)
    const oneTimePassword = generateOneTimePassword()
    const passwordHash = await hashPassword(oneTimePassword, options.passwordCost)
    await db.transaction(async (trx) => {
      await trx('users')
        .where({ id })
        .update({ passwordHash, mustChangePassword: true, oneTimePasswordExpiresAt: expiresAt() })
      await endSessionsOf(trx, id)
      await recordAudit(trx, {
        actorId,
        kind: 'person.password_reset',
        details: { personId: id },
      })
      const details = { personId: id }
      await recordSecurityEvent(trx, trail, {
        kind: 'password.reset',
        email: person.email,
        details,
      })
    })
    return { person: await get(id), oneTimePassword }
  }

  /** Changes one's own password and ends every other session of the person. */
  async function changeOwnPassword(
    id: number,
    current: string,
    next: string,
    trail: SecurityContext & { sessionId: string },
  ): Promise<Person> {
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
    refuseCommonPassword(next)
    const passwordHash = await hashPassword(next, options.passwordCost)
    await db.transaction(async (trx) => {
      await trx('users')
        .where({ id })
        .update({ passwordHash, mustChangePassword: false, oneTimePasswordExpiresAt: null })
      await endSessionsOf(trx, id, trail.sessionId)
      await recordAudit(trx, { actorId: id, kind: 'person.password_changed' })
      await recordSecurityEvent(trx, trail, { kind: 'password.changed', email: row.email })
    })
    return get(id)
  }

  return {
    find,
    get,
    list,
    listStaff,
    verifyCredentials,
    signedIn,
    create,
    update,
    resetPassword,
    changeOwnPassword,
  }
}

export type PeopleService = ReturnType<typeof createPeopleService>

/** Ends every stored session of one person (deactivation, password reset), or all but one. */
export async function endSessionsOf(trx: Knex, userId: number, exceptSid?: string): Promise<void> {
  const sessions = trx('sessions').whereRaw("JSON_VALUE(sess, '$.passport.user') = ?", [
    String(userId),
  ])
  if (exceptSid) sessions.whereNot('sid', exceptSid)
  await sessions.delete()
}

const sameRoles = (a: Role[], b: Role[]) => [...a].sort().join() === [...b].sort().join()

/** The security trail's entries for an administrator's edit: before and after values. */
function changesOf(before: Person, after: PersonUpdate) {
  const email = before.email
  const personId = before.id
  const events = []
  if (!sameRoles(before.roles, after.roles)) {
    const details = { personId, from: before.roles, to: after.roles }
    events.push({ kind: 'person.roles_changed' as const, email, details })
  }
  if (before.organisationId !== after.organisationId) {
    const details = { personId, from: before.organisationId, to: after.organisationId }
    events.push({ kind: 'person.organisation_changed' as const, email, details })
  }
  if (before.active !== after.active) {
    const kind = after.active ? ('person.reactivated' as const) : ('person.deactivated' as const)
    events.push({ kind, email, details: { personId } })
  }
  return events
}
