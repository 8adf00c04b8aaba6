import type { Knex } from 'knex'
import { NOTICE_ALLOWS } from '../../../shared/evidence/notice-standing'
import { AppError } from '../../errors'
import { loadNotices } from './notice-rows'

/** Holds in force on the case or on any of these items. */
export async function activeHoldIds(db: Knex, caseId: number, sampleIds: number[]) {
  const rows = (await db('legal_holds')
    .where({ caseId })
    .whereNull('releasedAt')
    .where((query) => query.whereNull('sampleId').orWhereIn('sampleId', sampleIds))
    .orderBy('id')
    .select('id')) as { id: number }[]
  return rows.map((row) => row.id)
}

/** Refuses (409 `legal_hold`) to alter or move an item while a hold locks it. */
export async function refuseUnderHold(db: Knex, caseId: number, lineage: number[], itemId: string) {
  const holdIds = await activeHoldIds(db, caseId, lineage)
  if (holdIds.length === 0) return
  throw new AppError(
    'legal_hold',
    `${itemId} is under a legal hold: it may not be sectioned, transferred or disposed of until an administrator releases the hold.`,
    { holdIds },
  )
}

/**
 * Refuses (409 `notice_required`) to section an item unless a notice covering it, or an item it
 * was cut from, allows the work: every party agreed, or the period passed with no open objection.
 */
export async function requireNotice(
  db: Knex,
  caseId: number,
  lineage: number[],
  itemId: string,
  now: Date,
) {
  const noticeIds = (await db('notice_samples')
    .whereIn('sampleId', lineage)
    .distinct('noticeId')) as { noticeId: number }[]
  const ids = noticeIds.map((row) => row.noticeId)
  const notices = await loadNotices(db, caseId, ids, now)
  const standings = notices.map((notice) => ({ noticeId: notice.id, standing: notice.standing }))
  if (standings.some((entry) => NOTICE_ALLOWS.includes(entry.standing))) return
  throw new AppError(
    'notice_required',
    standings.length === 0
      ? `No notice covers ${itemId}: record a notice to the interested parties before sectioning it.`
      : `The notice for ${itemId} does not allow the work yet: it waits for answers, the end of its period or the resolution of an objection.`,
    { notices: standings },
  )
}
