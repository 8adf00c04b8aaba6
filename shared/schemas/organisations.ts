import { z } from 'zod'
import { Email } from './auth'
import { trimmed } from './common'

const organisationFields = {
  name: trimmed(191, 'Name'),
  contactName: z.string().trim().max(191).nullable().default(null),
  contactEmail: Email.nullable().default(null),
}

export const OrganisationCreate = z.strictObject(organisationFields)
export type OrganisationCreate = z.infer<typeof OrganisationCreate>

export const OrganisationUpdate = z.strictObject({ ...organisationFields, active: z.boolean() })
export type OrganisationUpdate = z.infer<typeof OrganisationUpdate>

export interface Organisation {
  id: number
  name: string
  contactName: string | null
  contactEmail: string | null
  active: boolean
  createdAt: string
}
