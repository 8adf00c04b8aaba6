import type { RouteLocationNormalized, RouteLocationRaw, Router } from 'vue-router'
import { onSessionProblem } from '@/api/client'
import { useSessionStore } from '@/stores/session'

/** A return address from the query, accepted only when it stays inside the app. */
export function safeRedirect(value: unknown): string | undefined {
  return typeof value === 'string' && value.startsWith('/') && !value.startsWith('//')
    ? value
    : undefined
}

/** Shows the not-found page at the address asked for, so a forbidden page looks like no page. */
function notFound(to: RouteLocationNormalized): RouteLocationRaw {
  return {
    name: 'not-found',
    params: { pathMatch: to.path.substring(1).split('/') },
    query: to.query,
    hash: to.hash,
  }
}

/** The page to go to, remembering where the person was going unless it was the start page. */
function withReturn(name: string, to: RouteLocationNormalized): RouteLocationRaw {
  const start = to.fullPath === '/'
  return start ? { name } : { name, query: { redirect: to.fullPath } }
}

/**
 * Route guards by `meta.public` and `meta.roles`, and the app's answer when the API says the
 * session ended (back to sign-in), a new password is due (to the set-password page) or a second
 * factor must be set up (to its page).
 */
export function installSessionGuard(router: Router): void {
  router.beforeEach(async (to) => {
    const session = useSessionStore()
    await session.ensureLoaded()
    const user = session.user
    if (to.meta.public) {
      return to.name === 'sign-in' && user ? (safeRedirect(to.query.redirect) ?? '/') : true
    }
    if (!user) return withReturn('sign-in', to)
    if (user.mustChangePassword && to.name !== 'set-password') {
      return withReturn('set-password', to)
    }
    if (
      !user.mustChangePassword &&
      user.secondFactorSetupRequired &&
      to.name !== 'second-factor-setup'
    ) {
      return withReturn('second-factor-setup', to)
    }
    if (to.meta.roles && !session.hasRole(...to.meta.roles)) return notFound(to)
    return true
  })

  onSessionProblem((error) => {
    const current = router.currentRoute.value
    if (error.code === 'password_change_required') {
      if (current.name !== 'set-password') void router.push(withReturn('set-password', current))
      return
    }
    if (error.code === 'second_factor_setup_required') {
      if (current.name !== 'second-factor-setup') {
        void router.push(withReturn('second-factor-setup', current))
      }
      return
    }
    useSessionStore().forget()
    if (!current.meta.public) void router.push(withReturn('sign-in', current))
  })
}
