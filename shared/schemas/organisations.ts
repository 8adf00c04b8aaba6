import { z } from 'zod/mini'
import { Email } from './auth'
import { optionalText, trimmed } from './common'

const organisationFields = {
  name: trimmed(191, 'Name'),
  contactName: z._default(optionalText(191, 'Contact name'), null),
  contactEmail: z._default(z.nullable(Email), null),
  requiresSecondFactor: z._default(
    z.boolean({ error: 'Say whether two-factor sign-in is required.' }),
    false,
  ),
}

export const OrganisationCreate = z.strictObject(organisationFields)
export type OrganisationCreate = z.output<typeof OrganisationCreate>

export const OrganisationUpdate = z.strictObject({
  ...organisationFields,
  active: z.boolean({ error: 'Say whether the organisation is active.' }),
})
export type OrganisationUpdate = z.output<typeof OrganisationUpdate>

export interface Organisation {
  id: number
  name: string
  contactName: string | null
  contactEmail: string | null
  active: boolean
  /** its people must sign in with a second factor (staff always do) */
  requiresSecondFactor: boolean
  createdAt: string
}
