import type { Request, RequestHandler } from 'express'
import { can, type Action, type CaseRef } from '../../shared/access/policy'
import { AppError, Forbidden, Unauthorized } from '../errors'

/** The signed-in person, or 401. */
export function currentUser(req: Request): Express.User {
  if (!req.user) throw new Unauthorized()
  return req.user
}

export const requireSignedIn: RequestHandler = (req, _res, next) => {
  currentUser(req)
  next()
}

/** Someone still holding a one-time password may only change it (and sign out). */
export const requirePasswordSet: RequestHandler = (req, _res, next) => {
  if (currentUser(req).mustChangePassword) {
    throw new AppError('password_change_required', 'Set your own password first.')
  }
  next()
}

/** Staff (and clients whose organisation says so) set up their second factor before working. */
export const requireSecondFactorSet: RequestHandler = (req, _res, next) => {
  if (currentUser(req).secondFactorSetupRequired) {
    throw new AppError(
      'second_factor_setup_required',
      'Set up two-factor sign-in first: your role requires it.',
    )
  }
  next()
}

export function requirePermission(action: Action): RequestHandler {
  return (req, _res, next) => {
    authorize(req, action)
    next()
  }
}

export function authorize(req: Request, action: Action, resource?: CaseRef): Express.User {
  const user = currentUser(req)
  if (!can(user, action, resource)) throw new Forbidden()
  return user
}
