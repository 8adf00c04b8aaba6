import { z } from 'zod/mini'
import type { Role } from './roles'

export const PASSWORD_MIN_LENGTH = 12

const EMAIL_MESSAGE = 'Enter a valid e-mail address.'

/** An e-mail address, trimmed and lower-cased before it is checked. */
export const Email = z.pipe(
  z.string({ error: EMAIL_MESSAGE }).check(z.trim(), z.toLowerCase()),
  z.email({ error: EMAIL_MESSAGE }).check(z.maxLength(191, EMAIL_MESSAGE)),
)

export const LoginRequest = z.strictObject({
  email: Email,
  password: z
    .string({ error: 'Password is required.' })
    .check(z.minLength(1, 'Password is required.'), z.maxLength(1024)),
})
export type LoginRequest = z.output<typeof LoginRequest>

export const NewPassword = z.string({ error: 'Password is required.' }).check(
  z.minLength(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`),
  z.maxLength(1024, 'Use at most 1024 characters.'),
  z.refine((text) => text.trim() !== '', 'A password cannot be only spaces.'),
)

export const ChangePasswordRequest = z.strictObject({
  currentPassword: z
    .string()
    .check(z.minLength(1, 'Enter the current password.'), z.maxLength(1024)),
  newPassword: NewPassword,
})
export type ChangePasswordRequest = z.output<typeof ChangePasswordRequest>

const SixDigits = z
  .string({ error: 'Enter the 6-digit code.' })
  .check(z.trim(), z.regex(/^\d{6}$/, 'Enter the 6-digit code from your authenticator app.'))

export const SecondFactorCode = z.strictObject({ code: SixDigits })

export const RecoveryCodeRequest = z.strictObject({
  recoveryCode: z
    .string({ error: 'Enter a recovery code.' })
    .check(z.trim(), z.minLength(1, 'Enter a recovery code.'), z.maxLength(64)),
})

/** The second step of signing in: a code from the authenticator app, or one recovery code. */
export const SecondFactorRequest = z.union([SecondFactorCode, RecoveryCodeRequest])
export type SecondFactorRequest = z.output<typeof SecondFactorRequest>

export const SecondFactorConfirmRequest = SecondFactorCode
export type SecondFactorConfirmRequest = z.output<typeof SecondFactorConfirmRequest>

/** What enrolment shows: the key as a QR code (a data: URL) and as text. */
export interface SecondFactorEnrolment {
  secret: string
  uri: string
  qrCode: string
}

export interface SessionUser {
  id: number
  email: string
  name: string
  roles: Role[]
  organisationId: number | null
  mustChangePassword: boolean
  /** signed in with a password only, and a second factor is required: set one up first */
  secondFactorSetupRequired: boolean
  secondFactorEnrolled: boolean
}

/** The answer to a sign-in: the person, or the request for a second factor. */
export type SignInAnswer = { user: SessionUser } | { secondFactorRequired: true }
