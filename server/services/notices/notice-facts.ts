import type { Knex } from 'knex'
import type { Notice, NoticeFacts } from './notice-kinds'
import type { CaseFacts } from './recipients'

async function personName(db: Knex, id: number): Promise<string> {
  const row = (await db('users').where({ id }).first('name')) as { name: string } | undefined
  return row?.name ?? 'A client'
}

async function noticeDates(db: Knex, noticeId: number) {
  return (await db('notices')
    .where({ id: noticeId })
    .first('plannedWork', 'plannedOn', 'respondBy')) as {
    plannedWork: string
    plannedOn: string
    respondBy: string
  }
}

/** What the message will say beyond the case itself, read in the action's transaction. */
export async function kindFacts(
  db: Knex,
  notice: Notice,
): Promise<Omit<NoticeFacts, 'caseId' | 'caseNumber' | 'caseTitle' | 'recipientName'>> {
  switch (notice.kind) {
    case 'assigned':
      return { part: notice.part }
    case 'revisions_requested':
      return { reason: notice.reason }
    case 'report_issued':
      return { reportNumber: notice.reportNumber }
    case 'client_question':
      return { askedByName: await personName(db, notice.askedById), question: notice.question }
    case 'answer':
      return { answer: notice.answer }
    case 'destructive_testing_notice':
      return noticeDates(db, notice.noticeId)
    case 'review_requested':
    case 'approved':
      return {}
  }
}

export const caseFactsOf = (found: CaseFacts) => ({
  caseId: found.id,
  caseNumber: found.number,
  caseTitle: found.title,
})
