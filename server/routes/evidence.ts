import { Router, type Request, type Response } from 'express'
import type { Knex } from 'knex'
import { z } from 'zod/mini'
import { HoldCreate, HoldRelease } from '../../shared/schemas/holds'
import {
  NoticeAnswerCreate,
  NoticeCreate,
  NoticePeriod,
  ObjectionResolution,
} from '../../shared/schemas/notices'
import { ObservationCreate, WithdrawalCreate } from '../../shared/schemas/observations'
import { CustodyEventCreate, SampleCreate } from '../../shared/schemas/samples'
import { Id } from '../../shared/schemas/common'
import { allowOnCase, caseFileOf } from '../middleware/case-loader'
import { currentUser } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { ServiceContext } from '../services/context'
import type { EvidenceServices } from '../services/evidence'

const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })
const params = <T>(res: Response) => res.locals.params as T
const body = <T>(res: Response) => res.locals.body as T
const staffOnly = allowOnCase('case.viewInternal')
const handlers = allowOnCase('case.handleEvidence')
const administrators = allowOnCase('case.releaseEvidence')

/** `/samples…`: clients see the items marked for them; the service narrows their view. */
function sampleRoutes(db: Knex, { samples, custody }: EvidenceServices): Router {
  const router = Router({ mergeParams: true })
  const SampleParams = z.looseObject({ sampleId: Id })
  type SampleParams = z.output<typeof SampleParams>
  router.get('/', async (req, res) => {
    res.json({ data: await samples.list(contextOf(req, db), caseFileOf(res).id) })
  })
  router.post('/', handlers, validate('body', SampleCreate), async (req, res) => {
    const ctx = contextOf(req, db)
    const created = await samples.create(ctx, caseFileOf(res), body(res))
    res.status(201).json({ data: await samples.get(ctx, caseFileOf(res).id, created.id) })
  })
  router.get('/:sampleId', validate('params', SampleParams), async (req, res) => {
    const { sampleId } = params<SampleParams>(res)
    res.json({ data: await samples.get(contextOf(req, db), caseFileOf(res).id, sampleId) })
  })
  router.post(
    '/:sampleId/custody-events',
    handlers,
    validate('params', SampleParams),
    validate('body', CustodyEventCreate),
    async (req, res) => {
      const { sampleId } = params<SampleParams>(res)
      const ctx = contextOf(req, db)
      await custody.add(ctx, caseFileOf(res).id, sampleId, body(res))
      res.status(201).json({ data: await samples.get(ctx, caseFileOf(res).id, sampleId) })
    },
  )
  return router
}

/** `/notices…` and `/notice-period`: staff only; a new notice is e-mailed to the parties (outbox). */
function noticeRoutes(db: Knex, { notices }: EvidenceServices): Router {
  const router = Router({ mergeParams: true })
  const NoticeParams = z.looseObject({ noticeId: Id })
  const AnswerParams = z.looseObject({ noticeId: Id, answerId: Id })
  router.get('/notices', staffOnly, async (req, res) => {
    res.json({ data: await notices.list(contextOf(req, db), caseFileOf(res).id) })
  })
  router.post('/notices', handlers, validate('body', NoticeCreate), async (req, res) => {
    const created = await notices.create(contextOf(req, db), caseFileOf(res), body(res))
    res.status(201).json({ data: created })
  })
  router.post(
    '/notices/:noticeId/answers',
    handlers,
    validate('params', NoticeParams),
    validate('body', NoticeAnswerCreate),
    async (req, res) => {
      const { noticeId } = params<z.output<typeof NoticeParams>>(res)
      const notice = await notices.answer(
        contextOf(req, db),
        caseFileOf(res).id,
        noticeId,
        body(res),
      )
      res.status(201).json({ data: notice })
    },
  )
  router.post(
    '/notices/:noticeId/answers/:answerId/resolution',
    administrators,
    validate('params', AnswerParams),
    validate('body', ObjectionResolution),
    async (req, res) => {
      const { noticeId, answerId } = params<z.output<typeof AnswerParams>>(res)
      const { resolution } = body<{ resolution: string }>(res)
      const ctx = contextOf(req, db)
      res.json({
        data: await notices.resolve(ctx, caseFileOf(res).id, noticeId, answerId, resolution),
      })
    },
  )
  router.get('/notice-period', staffOnly, async (_req, res) => {
    res.json({ data: { days: await notices.period(db, caseFileOf(res).id) } })
  })
  router.put(
    '/notice-period',
    allowOnCase('case.edit'),
    validate('body', NoticePeriod),
    async (req, res) => {
      const { days } = body<NoticePeriod>(res)
      const saved = await notices.setPeriod(contextOf(req, db), caseFileOf(res).id, days)
      res.json({ data: { days: saved } })
    },
  )
  return router
}

function holdRoutes(db: Knex, { holds }: EvidenceServices): Router {
  const router = Router({ mergeParams: true })
  const HoldParams = z.looseObject({ holdId: Id })
  router.get('/', staffOnly, async (req, res) => {
    res.json({ data: await holds.list(contextOf(req, db), caseFileOf(res).id) })
  })
  router.post(
    '/',
    allowOnCase('case.placeHold'),
    validate('body', HoldCreate),
    async (req, res) => {
      res
        .status(201)
        .json({ data: await holds.place(contextOf(req, db), caseFileOf(res).id, body(res)) })
    },
  )
  router.post(
    '/:holdId/release',
    administrators,
    validate('params', HoldParams),
    validate('body', HoldRelease),
    async (req, res) => {
      const { holdId } = params<z.output<typeof HoldParams>>(res)
      const { reason } = body<{ reason: string }>(res)
      res.json({
        data: await holds.release(contextOf(req, db), caseFileOf(res).id, holdId, reason),
      })
    },
  )
  return router
}

function observationRoutes(db: Knex, { observations }: EvidenceServices): Router {
  const router = Router({ mergeParams: true })
  const ObservationParams = z.looseObject({ observationId: Id })
  router.get('/', staffOnly, async (req, res) => {
    res.json({ data: await observations.list(contextOf(req, db), caseFileOf(res).id) })
  })
  router.post('/', handlers, validate('body', ObservationCreate), async (req, res) => {
    const created = await observations.create(contextOf(req, db), caseFileOf(res).id, body(res))
    res.status(201).json({ data: created })
  })
  router.post(
    '/:observationId/withdraw',
    handlers,
    validate('params', ObservationParams),
    validate('body', WithdrawalCreate),
    async (req, res) => {
      const { observationId } = params<z.output<typeof ObservationParams>>(res)
      const { reason } = body<{ reason: string }>(res)
      const ctx = contextOf(req, db)
      res.json({
        data: await observations.withdraw(ctx, caseFileOf(res).id, observationId, reason),
      })
    },
  )
  return router
}

/** The evidence of one case, behind the case loader. */
export function evidenceRoutes(db: Knex, evidence: EvidenceServices): Router {
  const router = Router({ mergeParams: true })
  router.use('/samples', sampleRoutes(db, evidence))
  router.use('/holds', holdRoutes(db, evidence))
  router.use('/observations', observationRoutes(db, evidence))
  router.use(noticeRoutes(db, evidence))
  return router
}
