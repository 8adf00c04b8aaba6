import type { Request, RequestHandler, Response } from 'express'
import type { Knex } from 'knex'
import type { CaseAction } from '../../shared/access/policy'
import { IdParams } from '../../shared/schemas/common'
import { Forbidden, HiddenNotFound, NotFound } from '../errors'
import type { CaseRecord, CaseService } from '../services/cases'
import { authorize, currentUser } from './require-auth'
import { parseOrThrow } from './validate'
import { can } from '../../shared/access/policy'

/**
 * The one way into a case: finds it within the viewer's scope once (404 for a case they may not
 * see, exactly as for a missing one) and hands it on in `res.locals.caseFile`.
 */
export function caseLoader(db: Knex, cases: CaseService): RequestHandler {
  return async (req, res, next) => {
    const actor = authorize(req, 'case.view')
    const { id } = parseOrThrow(IdParams, { id: req.params.id }, 'URL')
    res.locals.caseFile = await loadOrHide(db, cases, actor, id)
    next()
  }
}

/** The case within the viewer's scope; one that exists outside it is refused as a hidden 404. */
async function loadOrHide(db: Knex, cases: CaseService, actor: Express.User, id: number) {
  try {
    return await cases.load({ actor, db }, id)
  } catch (error) {
    if (!(error instanceof NotFound)) throw error
    const exists = await db('cases').where({ id }).first('id')
    throw exists ? new HiddenNotFound(id, error.message) : error
  }
}

/**
 * For routes addressed by a child's own id (an attachment, a photo, a report): finds the case the
 * child belongs to, then enters the same loader, so a child of a case out of scope is a 404 too.
 */
export function childCaseLoader(
  db: Knex,
  cases: CaseService,
  caseIdOf: (db: Knex, childId: number) => Promise<number | undefined>,
): RequestHandler {
  return async (req, res, next) => {
    const actor = authorize(req, 'case.view')
    const { id } = parseOrThrow(IdParams, { id: req.params.id }, 'URL')
    const caseId = await caseIdOf(db, id)
    if (caseId === undefined) throw new NotFound()
    res.locals.caseFile = await loadOrHide(db, cases, actor, caseId)
    next()
  }
}

/** The case the loader found for this request. */
export function caseFileOf(res: Response): CaseRecord {
  const caseFile = res.locals.caseFile as CaseRecord | undefined
  if (!caseFile) throw new Error('caseFileOf() used on a route without the case loader')
  return caseFile
}

/** Refuses with 403 unless the signed-in person may take `action` on the loaded case. */
export function allowOnCase(action: CaseAction): RequestHandler {
  return (req: Request, res, next) => {
    if (!can(currentUser(req), action, caseFileOf(res))) throw new Forbidden()
    next()
  }
}
