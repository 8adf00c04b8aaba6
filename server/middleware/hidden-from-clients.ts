import type { RequestHandler } from 'express'
import { isStaff } from '../../shared/access/policy'
import { NotFound } from '../errors'
import { currentUser } from './require-auth'

/**
 * For a case's staff-only parts (drafts, review, the lab's readings): a client learns nothing of
 * them, not even that they exist, so the answer is 404 rather than 403.
 */
export const hiddenFromClients: RequestHandler = (req, _res, next) => {
  if (!isStaff(currentUser(req))) throw new NotFound()
  next()
}
