import type {
  ChangePasswordRequest,
  LoginRequest,
  SecondFactorEnrolment,
  SecondFactorRequest,
  SessionUser,
  SignInAnswer,
} from '../../shared/schemas/auth'
import { refreshCsrfToken, request } from './client'

/** The signed-in person, or null for a visitor who is not signed in. */
export async function fetchSessionUser(): Promise<SessionUser | null> {
  const { data } = await request<{ data: { user: SessionUser | null } }>('GET', '/auth/me')
  return data.user
}

/** The password step: the person, or the request for a second factor. */
export async function signIn(credentials: LoginRequest): Promise<SignInAnswer> {
  const { data } = await request<{ data: SignInAnswer }>('POST', '/auth/login', {
    body: credentials,
  })
  await refreshCsrfToken()
  return data
}

/** The second step: a code from the authenticator app or a recovery code. */
export async function completeSignIn(proof: SecondFactorRequest): Promise<SessionUser> {
  const { data } = await request<{ data: { user: SessionUser } }>('POST', '/auth/second-factor', {
    body: proof,
  })
  await refreshCsrfToken()
  return data.user
}

export async function beginEnrolment(): Promise<SecondFactorEnrolment> {
  const { data } = await request<{ data: SecondFactorEnrolment }>(
    'POST',
    '/auth/second-factor/enrolment',
  )
  return data
}

export async function confirmEnrolment(
  code: string,
): Promise<{ user: SessionUser; recoveryCodes: string[] }> {
  const { data } = await request<{ data: { user: SessionUser; recoveryCodes: string[] } }>(
    'POST',
    '/auth/second-factor/enrolment/confirm',
    { body: { code } },
  )
  return data
}

export async function signOut(): Promise<void> {
  await request<void>('POST', '/auth/logout')
  await refreshCsrfToken()
}

export async function changePassword(change: ChangePasswordRequest): Promise<SessionUser> {
  const { data } = await request<{ data: { user: SessionUser } }>('POST', '/auth/password', {
    body: change,
  })
  return data.user
}
