import type { RequestHandler } from 'express'
import { can, type CaseAction } from '../../shared/access/policy'
import type { CaseState } from '../../shared/workflow/case-states'
import { Forbidden } from '../errors'
import { caseFileOf } from './case-loader'
import { currentUser } from './require-auth'

/**
 * Refuses with 403 unless the person's part in the loaded case allows `action` in the state it
 * belongs to (`state`); the service then checks the case's real state under its lock, so a case
 * in the wrong state is answered 409 rather than 403.
 */
export function allowPart(action: CaseAction, state: CaseState): RequestHandler {
  return (req, res, next) => {
    if (!can(currentUser(req), action, { ...caseFileOf(res), status: state })) throw new Forbidden()
    next()
  }
}
