import type { Knex } from 'knex'
import { CaseCreate } from '../../shared/schemas/cases'
import type { Role } from '../../shared/schemas/roles'
import { hashPassword } from '../../server/auth/passwords'
import { newTotpSecret } from '../../server/auth/totp'
import { rememberSecondFactorKey } from '../helpers/second-factor-keys'
import { createCaseService } from '../../server/services/cases'

let sequence = 0
const unique = (prefix: string) => `${prefix}-${process.pid}-${Date.now()}-${++sequence}`

export const TEST_PASSWORD = 'correct horse battery staple'

export async function makeOrganisation(db: Knex, name = unique('Org')): Promise<number> {
  const [id] = (await db('organisations').insert({ name })) as number[]
  return id as number
}

export interface TestPerson {
  id: number
  email: string
  password: string
}

export interface PersonOptions {
  organisationId?: number
  mustChangePassword?: boolean
  active?: boolean
  /** enrolled with a second factor: staff are by default, as they must be to work */
  secondFactor?: boolean
}

export async function makePerson(
  db: Knex,
  roles: Role[],
  options: PersonOptions = {},
): Promise<TestPerson> {
  const email = `${unique(roles.join('-'))}@example.test`.toLowerCase()
  const enrolled = options.secondFactor ?? roles.some((role) => role !== 'client')
  const secret = enrolled ? newTotpSecret() : null
  if (secret) rememberSecondFactorKey(db, email, secret)
  const [id] = (await db('users').insert({
    secondFactorSecret: secret,
    secondFactorEnrolledAt: secret ? new Date() : null,
    email,
    name: `Test ${roles.join(' ')}`,
    passwordHash: await hashPassword(TEST_PASSWORD, 10),
    mustChangePassword: options.mustChangePassword ?? false,
    active: options.active ?? true,
    organisationId: options.organisationId ?? null,
  })) as number[]
  await db('user_roles').insert(roles.map((role) => ({ userId: id, role })))
  return { id: id as number, email, password: TEST_PASSWORD }
}

/** Their roles, or their roles with the other choices of `makePerson`. */
export type PersonSpec = Role[] | ({ roles: Role[] } & PersonOptions)

/** One person per key, made one after the other in the order given. */
export async function makePeople<Key extends string>(
  db: Knex,
  specs: Record<Key, PersonSpec>,
): Promise<Record<Key, TestPerson>> {
  const people = {} as Record<Key, TestPerson>
  for (const key of Object.keys(specs) as Key[]) {
    const spec = specs[key]
    people[key] = Array.isArray(spec)
      ? await makePerson(db, spec)
      : await makePerson(db, spec.roles, spec)
  }
  return people
}

/** A case opened through the real service, by an administrator-like actor `createdBy`. */
export async function makeCase(
  db: Knex,
  organisationId: number,
  createdBy: number,
  overrides: Partial<CaseCreate> = {},
) {
  const input = CaseCreate.parse({
    title: unique('Case'),
    organisationId,
    component: 'Test component',
    material: 'Test steel',
    ...overrides,
  })
  const actor = { id: createdBy, roles: ['admin'] as Role[], organisationId: null }
  return createCaseService().create({ actor, db }, input)
}
