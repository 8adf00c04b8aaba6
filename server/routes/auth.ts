import { Router, type NextFunction, type Request, type Response } from 'express'
import { ChangePasswordRequest, LoginRequest } from '../../shared/schemas/auth'
import type { Config } from '../config'
import { AppError } from '../errors'
import { issueCsrfToken } from '../auth/csrf'
import type { AppPassport } from '../auth/passport'
import { loginRateLimits } from '../auth/login-rate-limit'
import { currentUser, requireSignedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { toSessionUser, type PeopleService } from '../services/people'

const GENERIC_FAILURE = 'The e-mail address or password is not correct.'

function authenticate(passport: AppPassport, req: Request, res: Response, next: NextFunction) {
  req.body = res.locals.body
  passport.authenticate('local', (error: unknown, user: Express.User | false) => {
    if (error) return next(error)
    if (!user) return next(new AppError('invalid_credentials', GENERIC_FAILURE))
    // passport regenerates the session id here, which also retires the old CSRF token
    req.logIn(user, (loginError) => {
      if (loginError) return next(loginError)
      req.session.signedInAt = Date.now()
      res.json({ data: { user } })
    })
  })(req, res, next)
}

export function authRoutes(deps: { passport: AppPassport; people: PeopleService; config: Config }) {
  const router = Router()
  router.get('/csrf', issueCsrfToken)
  router.post(
    '/login',
    ...loginRateLimits(deps.config),
    validate('body', LoginRequest),
    (req, res, next) => authenticate(deps.passport, req, res, next),
  )
  // Signed out is an ordinary answer here, not a 401: browsers log every 401 as an error.
  router.get('/me', (req, res) => {
    res.json({ data: { user: req.user ?? null } })
  })
  router.post('/logout', (req, res, next) => {
    req.logOut((error) => {
      if (error) return next(error)
      req.session.destroy((destroyError) => {
        if (destroyError) return next(destroyError)
        res.clearCookie('fractolog.sid').status(204).end()
      })
    })
  })
  router.post(
    '/password',
    requireSignedIn,
    validate('body', ChangePasswordRequest),
    async (req, res) => {
      const { currentPassword, newPassword } = res.locals.body as ChangePasswordRequest
      const person = await deps.people.changeOwnPassword(
        currentUser(req).id,
        currentPassword,
        newPassword,
      )
      res.json({ data: { user: toSessionUser(person) } })
    },
  )
  return router
}
