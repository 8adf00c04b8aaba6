import type { ChangePasswordRequest, LoginRequest, SessionUser } from '../../shared/schemas/auth'
import { refreshCsrfToken, request } from './client'

/** The signed-in person, or null for a visitor who is not signed in. */
export async function fetchSessionUser(): Promise<SessionUser | null> {
  const { data } = await request<{ data: { user: SessionUser | null } }>('GET', '/auth/me')
  return data.user
}

export async function signIn(credentials: LoginRequest): Promise<SessionUser> {
  const { data } = await request<{ data: { user: SessionUser } }>('POST', '/auth/login', {
    body: credentials,
  })
  await refreshCsrfToken()
  return data.user
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
