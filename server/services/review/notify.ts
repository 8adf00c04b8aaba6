import type { Knex } from 'knex'
import { recordAudit } from '../audit'
import type { Notice } from '../notices/notice-kinds'
import { queueNotice } from '../notices/queue-notice'

/**
 * Every event of review, issue and the client's questions that someone should hear about goes
 * through here, inside the transaction of the change: the activity entry and the e-mail notice
 * (an outbox row, sent later by the sender) commit together, or neither does.
 */
interface Event {
  caseId: number
  actorId: number
  details?: Record<string, unknown>
  /** the words the message quotes: a client's question or the answer to it */
  text?: string
}

type NoticeOf = (event: Event) => Notice

const notify = (kind: string, noticeOf: NoticeOf) => async (trx: Knex, event: Event) => {
  await recordAudit(trx, {
    caseId: event.caseId,
    actorId: event.actorId,
    kind,
    details: event.details,
  })
  await queueNotice(trx, noticeOf(event))
}

const detail = (event: Event, key: string) => event.details?.[key]

/** to the case's reviewer: a draft waits for them */
export const notifySubmitted = notify('review.submitted', ({ caseId }) => ({
  kind: 'review_requested',
  caseId,
}))
/** to the lead: the reviewer asks for revisions, with the reason */
export const notifyRevisionsRequested = notify('review.revisions_requested', (event) => ({
  kind: 'revisions_requested',
  caseId: event.caseId,
  reason: String(detail(event, 'reason') ?? ''),
}))
/** to the lead: the draft is approved and may be issued */
export const notifyApproved = notify('review.approved', ({ caseId }) => ({
  kind: 'approved',
  caseId,
}))
/** to the client organisation's people: a report revision is issued */
export const notifyIssued = notify('report.issued', (event) => ({
  kind: 'report_issued',
  caseId: event.caseId,
  reportNumber: `${String(detail(event, 'number'))}, revision ${String(detail(event, 'revision'))}`,
}))
/** to the lead investigator: a client asked a question on a report */
export const notifyQuestion = notify('report.question_asked', (event) => ({
  kind: 'client_question',
  caseId: event.caseId,
  askedById: event.actorId,
  question: event.text ?? '',
}))
/** to the person who asked: the lead answered */
export const notifyAnswer = notify('report.question_answered', (event) => ({
  kind: 'answer',
  caseId: event.caseId,
  askedById: Number(detail(event, 'askedBy')),
  answer: event.text ?? '',
}))
