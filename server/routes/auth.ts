import { Router, type Request, type Response } from 'express'
import { ChangePasswordRequest, LoginRequest, SecondFactorRequest } from '../../shared/schemas/auth'
import type { Person } from '../../shared/schemas/people'
import type { Config } from '../config'
import { AppError, TooManyRequests, Unauthorized } from '../errors'
import { issueCsrfToken } from '../auth/csrf'
import { checkPassword, type AppPassport } from '../auth/passport'
import { sessionCookieName } from '../auth/session'
import { csrfTokenLimits, passwordChangeLimits } from '../auth/request-limits'
import { logIn, PENDING_SIGN_IN_MS, regenerateSession, saveSession } from '../auth/session-steps'
import { pause, SignInThrottle } from '../auth/sign-in-throttle'
import { currentUser, requireSignedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { Db } from '../db/knex'
import { toSessionUser, type PeopleService } from '../services/people'
import type { SecondFactorService } from '../services/second-factor'
import {
  recordSecurityEvent,
  securityContextOf,
  type SecurityEventInput,
} from '../services/security-events'
import { secondFactorEnrolmentRoutes } from './second-factor'

const GENERIC_FAILURE = 'The e-mail address or password is not correct.'
const WRONG_CODE = 'The code is not correct or has already been used.'
const EXPIRED = 'Your one-time password has expired. Ask an administrator to issue a new one.'

interface AuthDeps {
  db: Db
  passport: AppPassport
  people: PeopleService
  secondFactors: SecondFactorService
  config: Config
}

function trailOf(db: Db) {
  return (req: Request, event: SecurityEventInput, actorId?: number) =>
    recordSecurityEvent(db, { ...securityContextOf(req), ...(actorId ? { actorId } : {}) }, event)
}

async function completeSignIn(deps: AuthDeps, req: Request, res: Response, person: Person) {
  const user = toSessionUser(person)
  await logIn(req, user)
  req.session.signedInAt = Date.now()
  await deps.people.signedIn(person.id)
  await trailOf(deps.db)(req, { kind: 'sign_in.succeeded', email: person.email }, person.id)
  res.json({ data: { user } })
}

function signInRoute(deps: AuthDeps, throttle: SignInThrottle) {
  const trail = trailOf(deps.db)
  return async (req: Request, res: Response) => {
    const credentials = res.locals.body as LoginRequest
    const { email } = credentials
    const address = req.ip ?? ''
    const verdict = throttle.check(email, address)
    if (verdict.refused) {
      await trail(req, { kind: 'sign_in.throttled', email })
      throw new TooManyRequests()
    }
    await pause(verdict.delayMs)
    const check = await checkPassword(deps.passport, req, res, credentials)
    if (!check || 'expired' in check) {
      if (!check) throttle.failed(email, address)
      const reason = check ? 'one_time_password_expired' : 'wrong_credentials'
      await trail(req, { kind: 'sign_in.failed', email, details: { reason } })
      if (check) throw new AppError('one_time_password_expired', EXPIRED)
      throw new AppError('invalid_credentials', GENERIC_FAILURE)
    }
    throttle.succeeded(email, address)
    if (!check.person.secondFactorEnrolled) return completeSignIn(deps, req, res, check.person)
    await regenerateSession(req)
    req.session.pendingSignIn = { userId: check.person.id, email, at: Date.now() }
    await saveSession(req)
    res.json({ data: { secondFactorRequired: true } })
  }
}

function secondFactorRoute(deps: AuthDeps, throttle: SignInThrottle) {
  const trail = trailOf(deps.db)
  return async (req: Request, res: Response) => {
    const pending = req.session.pendingSignIn
    if (!pending || Date.now() - pending.at > PENDING_SIGN_IN_MS) {
      throw new Unauthorized('Sign in with your e-mail address and password first.')
    }
    const { userId, email } = pending
    const address = req.ip ?? ''
    const verdict = throttle.check(email, address)
    if (verdict.refused) {
      await trail(req, { kind: 'sign_in.throttled', email, details: { step: 'second_factor' } })
      throw new TooManyRequests()
    }
    await pause(verdict.delayMs)
    const body = res.locals.body as SecondFactorRequest
    const accepted =
      'code' in body
        ? await deps.secondFactors.verifyCode(userId, body.code)
        : await deps.secondFactors.useRecoveryCode(userId, body.recoveryCode)
    const person = accepted ? await deps.people.find(userId) : undefined
    if (!person?.active) {
      throttle.failed(email, address)
      await trail(req, { kind: 'second_factor.failed', email }, userId)
      throw new AppError('invalid_credentials', WRONG_CODE)
    }
    throttle.succeeded(email, address)
    if ('recoveryCode' in body) {
      await trail(req, { kind: 'second_factor.recovery_code_used', email }, userId)
    }
    delete req.session.pendingSignIn
    await completeSignIn(deps, req, res, person)
  }
}

function passwordRoute(deps: AuthDeps) {
  return async (req: Request, res: Response) => {
    const { currentPassword, newPassword } = res.locals.body as ChangePasswordRequest
    const context = { ...securityContextOf(req), sessionId: req.sessionID }
    const person = await deps.people.changeOwnPassword(
      currentUser(req).id,
      currentPassword,
      newPassword,
      context,
    )
    const user = toSessionUser(person)
    // a new id for this session too; it keeps its security token and sign-in time
    await logIn(req, user, true)
    res.json({ data: { user } })
  }
}

function signOutRoute(deps: AuthDeps) {
  const trail = trailOf(deps.db)
  return async (req: Request, res: Response) => {
    if (req.user) await trail(req, { kind: 'sign_out' })
    await new Promise<void>((done, fail) => req.logOut((e) => (e ? fail(e) : done())))
    await new Promise<void>((done, fail) => req.session.destroy((e) => (e ? fail(e) : done())))
    res.clearCookie(sessionCookieName(deps.config)).status(204).end()
  }
}

export function authRoutes(deps: AuthDeps) {
  const router = Router()
  const trail = trailOf(deps.db)
  router.get('/csrf', ...csrfTokenLimits(deps.config), issueCsrfToken)
  router.post(
    '/login',
    validate('body', LoginRequest),
    signInRoute(deps, new SignInThrottle(deps.config.loginLimits)),
  )
  router.post(
    '/second-factor',
    validate('body', SecondFactorRequest),
    secondFactorRoute(deps, new SignInThrottle(deps.config.loginLimits)),
  )
  // Signed out is an ordinary answer here, not a 401: browsers log every 401 as an error.
  router.get('/me', (req, res) => {
    res.json({ data: { user: req.user ?? null } })
  })
  router.post('/logout', signOutRoute(deps))
  router.post(
    '/password',
    requireSignedIn,
    ...passwordChangeLimits(deps.config, (req) => trail(req, { kind: 'password.throttled' })),
    validate('body', ChangePasswordRequest),
    passwordRoute(deps),
  )
  router.use('/second-factor/enrolment', secondFactorEnrolmentRoutes(deps))
  return router
}
