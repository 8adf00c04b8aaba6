import type { Knex } from 'knex'
import { noticeStanding } from '../../../shared/evidence/notice-standing'
import { todayIso } from '../../../shared/schemas/dates'
import type { Notice, NoticeAnswer, NoticeParty } from '../../../shared/schemas/notices'

interface NoticeRow {
  id: number
  caseId: number
  plannedWork: string
  plannedOn: string
  sentOn: string
  respondBy: string
  authorisedBy: string
  createdAt: Date
}

interface AnswerRow extends Omit<NoticeAnswer, 'resolvedAt' | 'createdAt'> {
  noticeId: number
  resolvedAt: Date | null
  createdAt: Date
}

const byNotice = <T extends { noticeId: number }>(rows: T[], id: number) =>
  rows.filter((row) => row.noticeId === id)

/** The case's notices (all, or those with these ids) with items, parties, answers, standing. */
export async function loadNotices(
  db: Knex,
  caseId: number,
  ids?: number[],
  now: Date = new Date(),
): Promise<Notice[]> {
  if (ids?.length === 0) return []
  const query = db('notices').where({ caseId }).orderBy('id')
  if (ids) query.whereIn('id', ids)
  const rows = (await query) as NoticeRow[]
  const noticeIds = rows.map((row) => row.id)
  const samples = (await db('notice_samples').whereIn('noticeId', noticeIds)) as {
    noticeId: number
    sampleId: number
  }[]
  const parties = (await db('notice_parties')
    .whereIn('noticeId', noticeIds)
    .orderBy('id')) as (NoticeParty & { noticeId: number })[]
  const answers = (await db('notice_answers')
    .whereIn('noticeId', noticeIds)
    .orderBy('id')) as AnswerRow[]
  const today = todayIso(now)
  return rows.map((row) => {
    const notice = {
      ...row,
      createdAt: row.createdAt.toISOString(),
      sampleIds: byNotice(samples, row.id).map((entry) => entry.sampleId),
      parties: byNotice(parties, row.id).map(({ noticeId: _n, ...party }) => party),
      answers: byNotice(answers, row.id).map(({ noticeId: _n, ...answer }) => ({
        ...answer,
        resolvedAt: answer.resolvedAt?.toISOString() ?? null,
        createdAt: answer.createdAt.toISOString(),
      })),
    }
    return { ...notice, standing: noticeStanding(notice, today) }
  })
}
