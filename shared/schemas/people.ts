import { z } from 'zod/mini'
import { Email } from './auth'
import { idOf, trimmed } from './common'
import { Role } from './roles'

const personFields = {
  email: Email,
  name: trimmed(191, 'Name'),
  roles: z.array(Role).check(
    z.minLength(1, 'Choose at least one role.'),
    z.maxLength(5),
    z.refine((roles) => new Set(roles).size === roles.length, 'Choose each role only once.'),
  ),
  organisationId: z._default(z.nullable(idOf('Choose the client organisation.')), null),
}

/** A client belongs to exactly one organisation and holds no staff role; staff belong to none. */
function checkRoleMix(
  value: { roles: Role[]; organisationId: number | null },
  ctx: z.core.$RefinementCtx<{ roles: Role[]; organisationId: number | null }>,
) {
  const isClient = value.roles.includes('client')
  if (isClient && value.roles.length > 1) {
    ctx.addIssue({ code: 'custom', path: ['roles'], message: 'A client holds no staff role.' })
  }
  if (isClient && value.organisationId === null) {
    ctx.addIssue({
      code: 'custom',
      path: ['organisationId'],
      message: 'Choose the client organisation.',
    })
  }
  if (!isClient && value.organisationId !== null) {
    ctx.addIssue({
      code: 'custom',
      path: ['organisationId'],
      message: 'Staff do not belong to a client organisation.',
    })
  }
}

export const PersonCreate = z.strictObject(personFields).check(z.superRefine(checkRoleMix))
export type PersonCreate = z.output<typeof PersonCreate>

export const PersonUpdate = z
  .strictObject({ ...personFields, active: z.boolean() })
  .check(z.superRefine(checkRoleMix))
export type PersonUpdate = z.output<typeof PersonUpdate>

export interface Person {
  id: number
  email: string
  name: string
  roles: Role[]
  organisationId: number | null
  active: boolean
  mustChangePassword: boolean
  secondFactorEnrolled: boolean
  /** staff always; a client when their organisation says so */
  secondFactorRequired: boolean
  lastSignInAt: string | null
  createdAt: string
}

/** The answer to creating a person or resetting a password: shown once, never stored. */
export interface PersonWithOneTimePassword {
  person: Person
  oneTimePassword: string
}
