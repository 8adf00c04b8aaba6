import { z } from 'zod/mini'
import { PageQuery } from './common'

/** What the security trail records (ASVS V7); each with the words the administrators' page shows. */
export const SECURITY_EVENT_LABELS = {
  'sign_in.succeeded': 'Signed in',
  'sign_in.failed': 'Sign-in refused',
  'sign_in.throttled': 'Sign-in attempt throttled',
  sign_out: 'Signed out',
  'csrf.refused': 'Request without a valid security token refused',
  'access.refused': 'Access refused',
  'password.changed': 'Own password changed',
  'password.reset': 'Password reset by an administrator',
  'password.throttled': 'Password change throttled',
  'person.created': 'Person added',
  'person.roles_changed': 'Roles changed',
  'person.organisation_changed': 'Organisation changed',
  'person.deactivated': 'Person deactivated',
  'person.reactivated': 'Person reactivated',
  'organisation.second_factor_changed': 'Organisation two-factor rule changed',
  'second_factor.enrolled': 'Two-factor sign-in set up',
  'second_factor.removed': 'Two-factor sign-in reset by an administrator',
  'second_factor.failed': 'Two-factor code refused',
  'second_factor.recovery_code_used': 'Recovery code used',
} as const

export type SecurityEventKind = keyof typeof SECURITY_EVENT_LABELS
export const SECURITY_EVENT_KINDS = Object.keys(SECURITY_EVENT_LABELS) as [
  SecurityEventKind,
  ...SecurityEventKind[],
]

export const SecurityEventQuery = z.strictObject({
  ...PageQuery,
  kind: z.optional(
    z.enum(SECURITY_EVENT_KINDS, { error: 'Choose a kind of security event from the list.' }),
  ),
})
export type SecurityEventQuery = z.output<typeof SecurityEventQuery>

export interface SecurityEvent {
  id: number
  kind: SecurityEventKind
  actorId: number | null
  /** the e-mail address the event concerns (given at sign-in, or the person changed) */
  email: string | null
  address: string | null
  userAgent: string | null
  details: Record<string, unknown> | null
  at: string
}
