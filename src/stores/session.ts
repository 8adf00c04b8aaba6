import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as authApi from '@/api/auth'
import { refreshCsrfToken } from '@/api/client'
import type {
  ChangePasswordRequest,
  LoginRequest,
  SecondFactorRequest,
  SessionUser,
} from '../../shared/schemas/auth'
import type { Role } from '../../shared/schemas/roles'
import { resetAllStores } from './reset-all'

/** The signed-in person, shared by the top bar, the route guards and every role check. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionUser | null>(null)
  const loaded = ref(false)
  let loading: Promise<void> | undefined

  const roles = computed<readonly Role[]>(() => user.value?.roles ?? [])
  const isStaff = computed(() => roles.value.some((role) => role !== 'client'))
  const canOpenCases = computed(() => hasRole('admin', 'investigator'))

  function hasRole(...wanted: Role[]): boolean {
    return wanted.some((role) => roles.value.includes(role))
  }

  async function fetchUser(): Promise<void> {
    const [sessionUser] = await Promise.all([authApi.fetchSessionUser(), refreshCsrfToken()])
    user.value = sessionUser
    loaded.value = true
  }

  /** Asks the server once per page load who is signed in. */
  function ensureLoaded(): Promise<void> {
    if (loaded.value) return Promise.resolve()
    loading ??= fetchUser().finally(() => {
      loading = undefined
    })
    return loading
  }

  /** The password step: the person, or null when a second factor is asked for next. */
  async function signIn(credentials: LoginRequest): Promise<SessionUser | null> {
    resetAllStores()
    const answer = await authApi.signIn(credentials)
    if ('secondFactorRequired' in answer) return null
    user.value = answer.user
    loaded.value = true
    return user.value
  }

  async function completeSignIn(proof: SecondFactorRequest): Promise<SessionUser> {
    user.value = await authApi.completeSignIn(proof)
    loaded.value = true
    return user.value
  }

  /** Confirms the new second factor; answers the recovery codes to show once. */
  async function confirmSecondFactor(code: string): Promise<string[]> {
    const { user: updated, recoveryCodes } = await authApi.confirmEnrolment(code)
    user.value = updated
    return recoveryCodes
  }

  async function signOut(): Promise<void> {
    await authApi.signOut()
    forget()
  }

  /** Clears every store and records that nobody is signed in, without asking the server. */
  function forget(): void {
    resetAllStores()
    loaded.value = true
  }

  async function changePassword(change: ChangePasswordRequest): Promise<void> {
    user.value = await authApi.changePassword(change)
  }

  /** Forgets the person locally, e.g. when the server says the session has ended. */
  function $reset(): void {
    user.value = null
    loaded.value = false
  }

  return {
    user,
    loaded,
    roles,
    isStaff,
    canOpenCases,
    hasRole,
    ensureLoaded,
    signIn,
    completeSignIn,
    confirmSecondFactor,
    signOut,
    forget,
    changePassword,
    $reset,
  }
})
