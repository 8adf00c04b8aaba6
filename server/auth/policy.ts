import type { Role } from '../../shared/schemas/roles'

export interface Actor {
  id: number
  roles: readonly Role[]
  organisationId: number | null
}

export interface CaseRef {
  organisationId: number
}

export type Action =
  | 'people.manage'
  | 'organisations.manage'
  | 'organisations.list'
  | 'staff.list'
  | 'cases.list'
  | 'case.create'
  | 'case.view'
  | 'case.changeStatus'

const STAFF: readonly Role[] = ['admin', 'investigator', 'lab', 'reviewer']

/** Which roles may take each action at all; case-level checks follow in `can`. */
const ALLOWED: Record<Action, readonly Role[]> = {
  'people.manage': ['admin'],
  'organisations.manage': ['admin'],
  'organisations.list': [...STAFF, 'client'],
  'staff.list': STAFF,
  'cases.list': [...STAFF, 'client'],
  'case.create': ['admin', 'investigator'],
  'case.view': [...STAFF, 'client'],
  'case.changeStatus': ['admin', 'investigator'],
}

export const isStaff = (actor: Actor) => actor.roles.some((role) => STAFF.includes(role))

/**
 * The one answer to "may this person do that (to this case)?". Staff work on all of the lab's
 * cases; a client only ever reaches the cases of their own organisation.
 */
export function can(actor: Actor, action: Action, resource?: CaseRef): boolean {
  if (!actor.roles.some((role) => ALLOWED[action].includes(role))) return false
  if (!resource || isStaff(actor)) return true
  return actor.organisationId !== null && resource.organisationId === actor.organisationId
}

/** The organisation a person's lists are limited to: none for staff, their own for a client. */
export function organisationScope(actor: Actor): number | undefined {
  if (isStaff(actor)) return undefined
  return actor.organisationId ?? -1
}
