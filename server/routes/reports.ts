import { sendPdf } from './report-pdf'
import { Router, type Request } from 'express'
import type { Knex } from 'knex'
import {
  AmendmentRequest,
  FigureParams,
  QuestionParams,
  ReportAnswerCreate,
  ReportQuestionCreate,
} from '../../shared/schemas/reports'
import { allowPart } from '../middleware/allow-part'
import { allowOnCase, caseFileOf, childCaseLoader } from '../middleware/case-loader'
import { currentUser, requirePermission } from '../middleware/require-auth'
import { parseOrThrow, validate } from '../middleware/validate'
import type { CaseService } from '../services/cases'
import type { ServiceContext } from '../services/context'
import { caseOfReport, type ReportService } from '../services/reports'
import { IdParams } from '../../shared/schemas/common'

const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })
const reportIdOf = (req: Request) => parseOrThrow(IdParams, { id: req.params.id }, 'URL').id

/** `/api/cases/:id/reports`: the revisions, newest first (a client: their organisation's). */
export function caseReportListRoutes(db: Knex, reports: ReportService): Router {
  const router = Router({ mergeParams: true })
  router.get('/', allowOnCase('case.readReports'), async (req, res) => {
    res.json({ data: await reports.list(contextOf(req, db), caseFileOf(res).id) })
  })
  return router
}

/** `/api/cases/:id/issue`: approved → issued, as the next revision. */
export function issueRoutes(db: Knex, reports: ReportService): Router {
  const router = Router({ mergeParams: true })
  router.post('/', allowPart('case.issue', 'approved'), async (req, res) => {
    const ctx = contextOf(req, db)
    const id = await reports.issue(ctx, caseFileOf(res).id)
    res.status(201).json({ data: await reports.get(ctx, caseFileOf(res), id) })
  })
  return router
}

/** `/api/cases/:id/amend`: issued or closed → drafting, with the reason. */
export function amendRoutes(db: Knex, reports: ReportService): Router {
  const router = Router({ mergeParams: true })
  router.post(
    '/',
    allowPart('case.amend', 'issued'),
    validate('body', AmendmentRequest),
    async (req, res) => {
      const { reason } = res.locals.body as AmendmentRequest
      await reports.amend(contextOf(req, db), caseFileOf(res).id, reason)
      res.json({ data: { status: 'drafting' } })
    },
  )
  return router
}

/** `/api/reports/:id…`: finds the revision's case, then the same loader and checks. */
export function reportRoutes(db: Knex, cases: CaseService, reports: ReportService): Router {
  const router = Router()
  // a client's: their organisation's; staff: every case's
  router.get('/', requirePermission('cases.list'), async (req, res) => {
    res.json({ data: await reports.readable(contextOf(req, db)) })
  })
  router.use('/:id', childCaseLoader(db, cases, caseOfReport), allowOnCase('case.readReports'))
  router.get('/:id', async (req, res) => {
    const ctx = contextOf(req, db)
    res.json({ data: await reports.get(ctx, caseFileOf(res), reportIdOf(req)) })
  })
  router.get('/:id/figures/:figureId', async (req, res) => {
    const { figureId } = parseOrThrow(
      FigureParams,
      { ...req.params, reportId: req.params.id },
      'URL',
    )
    const ctx = contextOf(req, db)
    const png = await reports.figure(ctx, caseFileOf(res).id, reportIdOf(req), figureId)
    res.setHeader('Content-Type', 'image/png')
    res.setHeader('Cache-Control', 'private, no-cache')
    res.setHeader('X-Content-Type-Options', 'nosniff')
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox")
    res.send(png)
  })
  router.get('/:id/pdf', async (req, res) => {
    const { bytes, fileName } = await reports.pdf(
      contextOf(req, db),
      caseFileOf(res).id,
      reportIdOf(req),
    )
    sendPdf(res, bytes, fileName)
  })
  router.post('/:id/acknowledge', allowOnCase('case.acknowledgeReport'), async (req, res) => {
    const ctx = contextOf(req, db)
    const ack = await reports.acknowledge(ctx, caseFileOf(res).id, reportIdOf(req))
    res.status(ack.created ? 201 : 200).json({ data: { acknowledgedAt: ack.acknowledgedAt } })
  })
  router.get('/:id/questions', async (req, res) => {
    res.json({ data: await reports.questions(contextOf(req, db), reportIdOf(req)) })
  })
  router.post(
    '/:id/questions',
    allowOnCase('case.askQuestion'),
    validate('body', ReportQuestionCreate),
    async (req, res) => {
      const { body } = res.locals.body as ReportQuestionCreate
      const ctx = contextOf(req, db)
      const question = await reports.askQuestion(ctx, caseFileOf(res).id, reportIdOf(req), body)
      res.status(201).json({ data: question })
    },
  )
  router.post(
    '/:id/questions/:questionId/answers',
    allowOnCase('case.answerQuestions'),
    validate('body', ReportAnswerCreate),
    async (req, res) => {
      const { questionId } = parseOrThrow(
        QuestionParams,
        { reportId: req.params.id, questionId: req.params.questionId },
        'URL',
      )
      const { body } = res.locals.body as ReportAnswerCreate
      const ids = { reportId: reportIdOf(req), questionId }
      const ctx = contextOf(req, db)
      res
        .status(201)
        .json({ data: await reports.answerQuestion(ctx, caseFileOf(res).id, ids, body) })
    },
  )
  return router
}
