import { csrfSync } from 'csrf-sync'
import type { RequestHandler } from 'express'
import { AppError } from '../errors'

// Synchroniser-token pattern: the token lives in the session and must come back in the
// X-CSRF-Token header on every state-changing request, sign-in included.
const { generateToken, isRequestValid } = csrfSync({
  getTokenFromRequest: (req) => req.get('x-csrf-token'),
})

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method) || isRequestValid(req)) {
    next()
    return
  }
  next(
    new AppError(
      'csrf_invalid',
      'The security token is missing or out of date. Reload and try again.',
    ),
  )
}

/** Saved before answering: a token whose session never reached the database would not work. */
export const issueCsrfToken: RequestHandler = (req, res, next) => {
  const token = generateToken(req)
  req.session.save((error) => (error ? next(error) : res.json({ data: { token } })))
}
