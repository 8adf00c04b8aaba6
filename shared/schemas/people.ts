import { z } from 'zod'
import { Email } from './auth'
import { idOf, trimmed } from './common'
import { Role } from './roles'

const personFields = {
  email: Email,
  name: trimmed(191, 'Name'),
  roles: z.array(Role).min(1, 'Choose at least one role.').max(5),
  organisationId: idOf('Choose the client organisation.').nullable().default(null),
}

/** A client belongs to exactly one organisation and holds no staff role; staff belong to none. */
function checkRoleMix(
  value: { roles: Role[]; organisationId: number | null },
  ctx: z.RefinementCtx,
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

export const PersonCreate = z.strictObject(personFields).superRefine(checkRoleMix)
export type PersonCreate = z.infer<typeof PersonCreate>

export const PersonUpdate = z
  .strictObject({ ...personFields, active: z.boolean() })
  .superRefine(checkRoleMix)
export type PersonUpdate = z.infer<typeof PersonUpdate>

export interface Person {
  id: number
  email: string
  name: string
  roles: Role[]
  organisationId: number | null
  active: boolean
  mustChangePassword: boolean
  lastSignInAt: string | null
  createdAt: string
}

/** The answer to creating a person or resetting a password: shown once, never stored. */
export interface PersonWithOneTimePassword {
  person: Person
  oneTimePassword: string
}
