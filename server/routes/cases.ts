import { Router, type Request, type Response } from 'express'
import type { Knex } from 'knex'
import { ActivityQuery } from '../../shared/schemas/activity'
import { CaseCreate, CaseListQuery, CaseStatusChange, CaseUpdate } from '../../shared/schemas/cases'
import { allowOnCase, caseFileOf, caseLoader } from '../middleware/case-loader'
import { idempotencyKeyOf } from '../middleware/idempotency-key'
import { currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { listActivity } from '../services/activity'
import type { CaseService } from '../services/cases'
import type { ServiceContext } from '../services/context'
import { fingerprintOf, onceForKey, type Answer } from '../services/idempotency'
import type { ServiceEventService } from '../services/service-events'
import type { EvidenceServices } from '../services/evidence'
import { evidenceRoutes } from './evidence'
import { serviceEventRoutes } from './service-events'
import { specimenRoutes, tensileRecordRoutes, type RecordRouteDeps } from './mechanical-tests'

const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })

/** Sub-routers of one case by path (`photos` → `/api/cases/:id/photos`), behind the loader. */
export type CaseChildRoutes = Record<string, Router>

/** Routes of one case, behind the case loader. */
function oneCaseRoutes(
  db: Knex,
  cases: CaseService,
  events: ServiceEventService,
  evidence: EvidenceServices,
  tests: RecordRouteDeps,
  children: CaseChildRoutes,
): Router {
  const router = Router({ mergeParams: true })
  router.use('/service-events', serviceEventRoutes(db, events))
  router.use(evidenceRoutes(db, evidence))
  router.use('/specimens', specimenRoutes(db, tests))
  router.use('/tensile-records', tensileRecordRoutes(db, tests))
  for (const [path, child] of Object.entries(children)) router.use(`/${path}`, child)
  const answer = async (req: Request, res: Response, status = 200) => {
    const ctx = contextOf(req, db)
    res.status(status).json({ data: await cases.view(ctx, caseFileOf(res)) })
  }

  router.get('/', (req, res) => answer(req, res))
  router.patch('/', allowOnCase('case.edit'), validate('body', CaseUpdate), async (req, res) => {
    const ctx = contextOf(req, db)
    const change = res.locals.body as CaseUpdate
    res.locals.caseFile = await cases.update(ctx, caseFileOf(res).id, change)
    await answer(req, res)
  })
  router.post(
    '/status',
    allowOnCase('case.changeStatus'),
    validate('body', CaseStatusChange),
    async (req, res) => {
      const { status } = res.locals.body as CaseStatusChange
      res.locals.caseFile = await cases.changeStatus(contextOf(req, db), caseFileOf(res).id, status)
      await answer(req, res)
    },
  )
  router.get(
    '/activity',
    allowOnCase('case.viewActivity'),
    validate('query', ActivityQuery),
    async (_req, res) => {
      res.json(await listActivity(db, caseFileOf(res).id, res.locals.query as ActivityQuery))
    },
  )
  return router
}

/** Opens a case; with an Idempotency-Key, a repeat of the same request gets the first answer. */
async function createOnce(req: Request, db: Knex, cases: CaseService, input: CaseCreate) {
  const actor = currentUser(req)
  const create = async (trx: Knex): Promise<Answer> => {
    const created = await cases.create({ actor, db: trx }, input)
    return { status: 201, body: { data: await cases.view({ actor, db: trx }, created) } }
  }
  const key = idempotencyKeyOf(req)
  if (!key) return { ...(await create(db)), replayed: false }
  const fingerprint = fingerprintOf('POST /api/cases', input)
  return onceForKey(db, { personId: actor.id, key, fingerprint, now: new Date() }, create)
}

export function caseRoutes(
  db: Knex,
  cases: CaseService,
  events: ServiceEventService,
  evidence: EvidenceServices,
  tests: RecordRouteDeps,
  children: CaseChildRoutes = {},
): Router {
  const router = Router()
  router.get(
    '/',
    requirePermission('cases.list'),
    validate('query', CaseListQuery),
    async (req, res) => {
      res.json(await cases.list(contextOf(req, db), res.locals.query as CaseListQuery))
    },
  )
  router.post(
    '/',
    requirePermission('case.create'),
    validate('body', CaseCreate),
    async (req, res) => {
      const answer = await createOnce(req, db, cases, res.locals.body as CaseCreate)
      if (answer.replayed) res.set('Idempotent-Replayed', 'true')
      res.status(answer.status).json(answer.body)
    },
  )
  router.use(
    '/:id',
    caseLoader(db, cases),
    oneCaseRoutes(db, cases, events, evidence, tests, children),
  )
  return router
}
