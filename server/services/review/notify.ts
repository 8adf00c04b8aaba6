import type { Knex } from 'knex'
import { recordAudit } from '../audit'

/**
 * Every event of review, issue and the client's questions that someone should hear about goes
 * through here, inside the transaction of the change: the activity entry is written now, and the
 * e-mail notice joins it (the outbox's `queueNotice(trx, …)`, beside each `recordAudit` below) so
 * both commit or neither does.
 */
interface Event {
  caseId: number
  actorId: number
  details?: Record<string, unknown>
}

const record = (kind: string) => (trx: Knex, event: Event) =>
  recordAudit(trx, { caseId: event.caseId, actorId: event.actorId, kind, details: event.details })

/** to the case's reviewer: a draft waits for them */
export const notifySubmitted = record('review.submitted')
/** to the lead and co-investigators: the reviewer asks for revisions, with the reason */
export const notifyRevisionsRequested = record('review.revisions_requested')
/** to the lead and co-investigators: the draft is approved and may be issued */
export const notifyApproved = record('review.approved')
/** to the client organisation's people (and the case's contact): a report revision is issued */
export const notifyIssued = record('report.issued')
/** to the lead investigator: a client asked a question on a report */
export const notifyQuestion = record('report.question_asked')
/** to the person who asked: the lead answered */
export const notifyAnswer = record('report.question_answered')
