import { z } from 'zod'

export const STAFF_ROLES = ['admin', 'investigator', 'lab', 'reviewer'] as const
export const ROLES = [...STAFF_ROLES, 'client'] as const

export const Role = z.enum(ROLES)
export type Role = z.infer<typeof Role>

export const StaffRole = z.enum(STAFF_ROLES)
export type StaffRole = z.infer<typeof StaffRole>

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  investigator: 'Investigator',
  lab: 'Lab technician',
  reviewer: 'Reviewer',
  client: 'Client',
}
