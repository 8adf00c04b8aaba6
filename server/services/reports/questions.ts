import type { Knex } from 'knex'
import type { ReportAcknowledgement, ReportQuestion } from '../../../shared/schemas/reports'
import { NotFound } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { notifyAnswer, notifyQuestion } from '../review/notify'
import { findReportRow } from './report-rows'

export async function acknowledgementsOf(
  db: Knex,
  reportId: number,
): Promise<ReportAcknowledgement[]> {
  const rows = (await db('report_acknowledgements')
    .join('users', 'users.id', 'report_acknowledgements.personId')
    .where({ reportId })
    .orderBy('acknowledgedAt')
    .select('users.name as personName', 'report_acknowledgements.acknowledgedAt')) as {
    personName: string
    acknowledgedAt: Date
  }[]
  return rows.map((row) => ({ ...row, acknowledgedAt: row.acknowledgedAt.toISOString() }))
}

/** The questions on a revision, oldest first, each with its answers. */
export async function questionThread(db: Knex, reportId: number): Promise<ReportQuestion[]> {
  const questions = (await db('report_questions')
    .join('users', 'users.id', 'report_questions.askedBy')
    .where({ reportId })
    .orderBy('report_questions.id')
    .select('report_questions.*', 'users.name as askedByName')) as {
    id: number
    body: string
    askedByName: string
    askedAt: Date
  }[]
  const answers = (await db('report_answers')
    .join('users', 'users.id', 'report_answers.answeredBy')
    .whereIn(
      'report_answers.questionId',
      questions.map((q) => q.id),
    )
    .orderBy('report_answers.id')
    .select('report_answers.*', 'users.name as answeredByName')) as {
    id: number
    questionId: number
    body: string
    answeredByName: string
    answeredAt: Date
  }[]
  return questions.map((q) => ({
    id: q.id,
    body: q.body,
    askedByName: q.askedByName,
    askedAt: q.askedAt.toISOString(),
    answers: answers
      .filter((a) => a.questionId === q.id)
      .map((a) => ({
        id: a.id,
        body: a.body,
        answeredByName: a.answeredByName,
        answeredAt: a.answeredAt.toISOString(),
      })),
  }))
}

async function reportOfCase(db: Knex, caseId: number, reportId: number) {
  const row = await findReportRow(db, reportId)
  if (!row || row.caseId !== caseId) throw new NotFound('No such report.')
  return row
}

const isDuplicate = (error: unknown) => (error as { errno?: number }).errno === 1062

/** Receipt, once per person: a repeat answers the first acknowledgement and records nothing. */
export async function acknowledge({ actor, db }: ServiceContext, caseId: number, reportId: number) {
  return db.transaction(async (trx) => {
    const report = await reportOfCase(trx, caseId, reportId)
    let created = true
    try {
      await trx('report_acknowledgements').insert({ reportId, personId: actor.id })
    } catch (error) {
      if (!isDuplicate(error)) throw error
      created = false
    }
    if (created) {
      const details = { reportId, number: report.number, revision: report.revision }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'report.acknowledged', details })
    }
    const row = (await trx('report_acknowledgements')
      .where({ reportId, personId: actor.id })
      .first('acknowledgedAt')) as { acknowledgedAt: Date }
    return { acknowledgedAt: row.acknowledgedAt.toISOString(), created }
  })
}

export async function askQuestion(
  { actor, db }: ServiceContext,
  caseId: number,
  reportId: number,
  body: string,
): Promise<ReportQuestion> {
  await db.transaction(async (trx) => {
    const report = await reportOfCase(trx, caseId, reportId)
    const [id] = (await trx('report_questions').insert({
      reportId,
      askedBy: actor.id,
      body,
    })) as number[]
    const details = { reportId, questionId: id, revision: report.revision }
    await notifyQuestion(trx, { caseId, actorId: actor.id, details, text: body })
  })
  const thread = await questionThread(db, reportId)
  return thread[thread.length - 1] as ReportQuestion
}

export async function answerQuestion(
  { actor, db }: ServiceContext,
  caseId: number,
  ids: { reportId: number; questionId: number },
  body: string,
): Promise<ReportQuestion> {
  await db.transaction(async (trx) => {
    const report = await reportOfCase(trx, caseId, ids.reportId)
    const question = (await trx('report_questions')
      .where({ id: ids.questionId, reportId: ids.reportId })
      .first('id', 'askedBy')) as { id: number; askedBy: number } | undefined
    if (!question) throw new NotFound('No such question on this report.')
    await trx('report_answers').insert({ questionId: question.id, answeredBy: actor.id, body })
    const details = {
      reportId: ids.reportId,
      questionId: question.id,
      askedBy: question.askedBy,
      revision: report.revision,
    }
    await notifyAnswer(trx, { caseId, actorId: actor.id, details, text: body })
  })
  const thread = await questionThread(db, ids.reportId)
  return thread.find((q) => q.id === ids.questionId) as ReportQuestion
}
