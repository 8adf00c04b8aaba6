import type { Knex } from 'knex'
import type { Approval, ReviewStep, ReviewView } from '../../../shared/schemas/review'
import type { CaseState } from '../../../shared/workflow/case-states'
import { AppError } from '../../errors'
import { findCase, type CaseRecord } from '../cases/case-record'
import type { ServiceContext } from '../context'
import { documentOf, findFindings } from '../findings/findings-rows'
import { contentSha256 } from './content-hash'
import { draftAuthorIds } from './four-eyes'
import { guardAction } from './guard'
import { notifyApproved, notifyRevisionsRequested, notifySubmitted } from './notify'
import { currentApproval } from './approvals'
import { reviewHistory } from './history'

async function moveCase(trx: Knex, record: CaseRecord, to: CaseState) {
  await trx('cases')
    .where({ id: record.id })
    .update({ status: to, version: record.version + 1, updatedAt: trx.fn.now() })
}

function refuse(message: string): never {
  throw new AppError('invalid_transition', message)
}

export function createReviewService() {
  /** drafting or revisions requested → in review, by the lead (or an administrator) */
  async function submit({ actor, db }: ServiceContext, caseId: number): Promise<void> {
    await db.transaction(async (trx) => {
      const record = await findCase(trx, caseId, undefined, { forUpdate: true })
      guardAction(actor, 'case.submitForReview', record, ['drafting', 'revisions_requested'])
      if (record.reviewerId === null) refuse('Assign a reviewer to the case before submitting.')
      if (!(await findFindings(trx, caseId))) refuse('Write the findings before submitting them.')
      await moveCase(trx, record, 'in_review')
      const details = { from: record.status, to: 'in_review', reviewerId: record.reviewerId }
      await notifySubmitted(trx, { caseId, actorId: actor.id, details })
    })
  }

  /** in review → revisions requested, by the assigned reviewer, with the reason */
  async function requestRevisions({ actor, db }: ServiceContext, caseId: number, reason: string) {
    await db.transaction(async (trx) => {
      const record = await findCase(trx, caseId, undefined, { forUpdate: true })
      guardAction(actor, 'case.decideReview', record, ['in_review'])
      await moveCase(trx, record, 'revisions_requested')
      const details = { from: 'in_review', to: 'revisions_requested', reason }
      await notifyRevisionsRequested(trx, { caseId, actorId: actor.id, details })
    })
  }

  /**
   * in review → approved, by the assigned reviewer who wrote none of it: the approval keeps who,
   * when, and the SHA-256 of the exact content approved.
   */
  async function approve({ actor, db }: ServiceContext, caseId: number): Promise<void> {
    await db.transaction(async (trx) => {
      const record = await findCase(trx, caseId, undefined, { forUpdate: true })
      if ((await draftAuthorIds(trx, record)).includes(actor.id))
        throw new AppError(
          'four_eyes',
          'You wrote, lead or co-investigate this draft: another engineer must approve it.',
        )
      guardAction(actor, 'case.decideReview', record, ['in_review'])
      const findings = await findFindings(trx, caseId, true)
      if (!findings) refuse('There is no draft to approve.')
      const sha256 = contentSha256(documentOf(findings))
      await trx('approvals').insert({ caseId, approverId: actor.id, contentSha256: sha256 })
      await moveCase(trx, record, 'approved')
      const details = { from: 'in_review', to: 'approved', contentSha256: sha256 }
      await notifyApproved(trx, { caseId, actorId: actor.id, details })
    })
  }

  async function view({ db }: ServiceContext, record: CaseRecord): Promise<ReviewView> {
    const approval: Approval | null = await currentApproval(db, record.id)
    const history: ReviewStep[] = await reviewHistory(db, record.id)
    return { approval, authorIds: await draftAuthorIds(db, record), history }
  }

  return { submit, requestRevisions, approve, view }
}

export type ReviewService = ReturnType<typeof createReviewService>
