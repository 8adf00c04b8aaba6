import { z } from 'zod'
import type { Role } from './roles'

export const PASSWORD_MIN_LENGTH = 12

export const Email = z
  .email({ error: 'Enter a valid e-mail address.' })
  .trim()
  .toLowerCase()
  .max(191)

export const LoginRequest = z.strictObject({
  email: Email,
  password: z.string({ error: 'Password is required.' }).min(1, 'Password is required.').max(1024),
})
export type LoginRequest = z.infer<typeof LoginRequest>

export const NewPassword = z
  .string({ error: 'Password is required.' })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(1024, 'Use at most 1024 characters.')

export const ChangePasswordRequest = z.strictObject({
  currentPassword: z.string().min(1, 'Enter the current password.').max(1024),
  newPassword: NewPassword,
})
export type ChangePasswordRequest = z.infer<typeof ChangePasswordRequest>

export interface SessionUser {
  id: number
  email: string
  name: string
  roles: Role[]
  organisationId: number | null
  mustChangePassword: boolean
}
