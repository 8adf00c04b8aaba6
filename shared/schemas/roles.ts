import { z } from 'zod/mini'

export const STAFF_ROLES = ['admin', 'investigator', 'lab', 'reviewer'] as const
export const ROLES = [...STAFF_ROLES, 'client'] as const

export const Role = z.enum(ROLES, { error: 'Choose a role from the list.' })
export type Role = z.output<typeof Role>

export const StaffRole = z.enum(STAFF_ROLES)
export type StaffRole = z.output<typeof StaffRole>

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  investigator: 'Investigator',
  lab: 'Lab technician',
  reviewer: 'Reviewer',
  client: 'Client',
}
