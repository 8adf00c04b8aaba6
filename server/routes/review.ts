import { Router, type Request, type Response } from 'express'
import type { Knex } from 'knex'
import { CommentParams, ReviewCommentCreate, RevisionRequest } from '../../shared/schemas/review'
import { allowPart } from '../middleware/allow-part'
import { allowOnCase, caseFileOf } from '../middleware/case-loader'
import { hiddenFromClients } from '../middleware/hidden-from-clients'
import { currentUser } from '../middleware/require-auth'
import { parseOrThrow, validate } from '../middleware/validate'
import { findCase } from '../services/cases/case-record'
import type { ServiceContext } from '../services/context'
import type { ReviewService } from '../services/review'
import { addComment, listComments, resolveComment } from '../services/review/comments'

const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })

/** `/api/cases/:id/review`, behind the case loader; clients learn nothing of a review. */
export function reviewRoutes(db: Knex, review: ReviewService): Router {
  const router = Router({ mergeParams: true })
  router.use(hiddenFromClients, allowOnCase('case.readFindings'))

  /** The case's state after a step, with the review as it now stands. */
  const answer = async (req: Request, res: Response) => {
    const record = await findCase(db, caseFileOf(res).id)
    const data = { status: record.status, review: await review.view(contextOf(req, db), record) }
    res.json({ data })
  }

  router.get('/', async (req, res) => {
    res.json({ data: await review.view(contextOf(req, db), caseFileOf(res)) })
  })
  router.post('/submit', allowPart('case.submitForReview', 'drafting'), async (req, res) => {
    await review.submit(contextOf(req, db), caseFileOf(res).id)
    await answer(req, res)
  })
  router.post(
    '/request-revisions',
    allowPart('case.decideReview', 'in_review'),
    validate('body', RevisionRequest),
    async (req, res) => {
      const { reason } = res.locals.body as RevisionRequest
      await review.requestRevisions(contextOf(req, db), caseFileOf(res).id, reason)
      await answer(req, res)
    },
  )
  // no part check here: an author is refused with `four_eyes` whatever their part or roles
  router.post('/approve', async (req, res) => {
    await review.approve(contextOf(req, db), caseFileOf(res).id)
    await answer(req, res)
  })
  router.get('/comments', async (_req, res) => {
    res.json({ data: await listComments(db, caseFileOf(res).id) })
  })
  router.post(
    '/comments',
    allowOnCase('case.comment'),
    validate('body', ReviewCommentCreate),
    async (req, res) => {
      const input = res.locals.body as ReviewCommentCreate
      const comment = await addComment(contextOf(req, db), caseFileOf(res).id, input)
      res.status(201).json({ data: comment })
    },
  )
  router.post('/comments/:commentId/resolve', allowOnCase('case.comment'), async (req, res) => {
    const { commentId } = parseOrThrow(CommentParams, req.params, 'URL')
    const comment = await resolveComment(contextOf(req, db), caseFileOf(res).id, commentId)
    res.json({ data: comment })
  })
  return router
}
