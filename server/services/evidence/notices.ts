import type { Knex } from 'knex'
import { addDays } from '../../../shared/evidence/notice-standing'
import { todayIso } from '../../../shared/schemas/dates'
import type { InterestedParty } from '../../../shared/schemas/cases'
import type { Notice, NoticeAnswerCreate, NoticeCreate } from '../../../shared/schemas/notices'
import { Conflict, NotFound, ValidationError } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { loadNotices } from './notice-rows'
import { queueNotice } from '../notices/queue-notice'

function refuse(path: string, message: string): never {
  throw new ValidationError(message, [{ path, message }])
}

async function checkSamplesOfCase(trx: Knex, caseId: number, sampleIds: number[]) {
  const unique = [...new Set(sampleIds)]
  const found = (await trx('samples')
    .where({ caseId })
    .whereIn('id', unique)
    .count({ n: '*' })) as [{ n: number }]
  if (Number(found[0].n) !== unique.length) refuse('sampleIds', 'Choose items of this case.')
  return unique
}

/**
 * Notices before destructive work (ASTM E860 practice). A notice is e-mailed to the parties
 * with an address (queued in the same transaction); their answers are recorded as given.
 */
export function createNoticeService(deps: { clock?: () => Date } = {}) {
  const clock = deps.clock ?? (() => new Date())

  async function one(db: Knex, caseId: number, noticeId: number): Promise<Notice> {
    const [notice] = await loadNotices(db, caseId, [noticeId], clock())
    if (!notice) throw new NotFound('No such notice in this case.')
    return notice
  }

  const list = ({ db }: ServiceContext, caseId: number) =>
    loadNotices(db, caseId, undefined, clock())

  /** Records a notice to the parties named on the case now, with the case's notice period. */
  async function create(
    { actor, db }: ServiceContext,
    caseRef: { id: number; interestedParties: InterestedParty[] },
    input: NoticeCreate,
  ): Promise<Notice> {
    if (input.sentOn > todayIso(clock())) refuse('sentOn', 'A notice cannot be sent in the future.')
    if (input.plannedOn < input.sentOn) {
      refuse('plannedOn', 'The work cannot be planned before the notice was sent.')
    }
    const id = await db.transaction(async (trx) => {
      const sampleIds = await checkSamplesOfCase(trx, caseRef.id, input.sampleIds)
      const { noticePeriodDays } = (await trx('cases')
        .where({ id: caseRef.id })
        .first('noticePeriodDays')) as { noticePeriodDays: number }
      const { sampleIds: _s, ...fields } = input
      const [noticeId] = (await trx('notices').insert({
        ...fields,
        caseId: caseRef.id,
        respondBy: addDays(input.sentOn, noticePeriodDays),
        recordedBy: actor.id,
      })) as number[]
      await trx('notice_samples').insert(sampleIds.map((sampleId) => ({ noticeId, sampleId })))
      if (caseRef.interestedParties.length > 0) {
        await trx('notice_parties').insert(
          caseRef.interestedParties.map((party) => ({ ...party, noticeId })),
        )
      }
      const details = { noticeId, sampleIds, plannedOn: input.plannedOn }
      await recordAudit(trx, {
        caseId: caseRef.id,
        actorId: actor.id,
        kind: 'notice.recorded',
        details,
      })
      const toParties = { caseId: caseRef.id, noticeId: noticeId as number }
      await queueNotice(trx, { kind: 'destructive_testing_notice', ...toParties }, clock)
      return noticeId as number
    })
    return one(db, caseRef.id, id)
  }

  /** Records a party's answer; the latest answer of each party counts. */
  async function answer(
    { actor, db }: ServiceContext,
    caseId: number,
    noticeId: number,
    input: NoticeAnswerCreate,
  ): Promise<Notice> {
    if (input.answeredOn > todayIso(clock())) {
      refuse('answeredOn', 'An answer cannot come from the future.')
    }
    await db.transaction(async (trx) => {
      await one(trx, caseId, noticeId)
      const party = await trx('notice_parties').where({ id: input.partyId, noticeId }).first('id')
      if (!party) refuse('partyId', 'Choose a party this notice went to.')
      await trx('notice_answers').insert({ ...input, noticeId, recordedBy: actor.id })
      const details = { noticeId, partyId: input.partyId, answer: input.answer }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'notice.answered', details })
    })
    return one(db, caseId, noticeId)
  }

  /** An administrator settles an objection; the objection itself stays on record. */
  async function resolve(
    { actor, db }: ServiceContext,
    caseId: number,
    noticeId: number,
    answerId: number,
    resolution: string,
  ): Promise<Notice> {
    await db.transaction(async (trx) => {
      await one(trx, caseId, noticeId)
      const row = (await trx('notice_answers')
        .where({ id: answerId, noticeId })
        .forUpdate()
        .first()) as { answer: string; resolvedAt: Date | null } | undefined
      if (!row) throw new NotFound('No such answer to this notice.')
      if (row.answer !== 'objected') throw new Conflict('Only an objection can be resolved.')
      if (row.resolvedAt !== null) throw new Conflict('That objection was resolved already.')
      await trx('notice_answers')
        .where({ id: answerId })
        .update({ resolution, resolvedBy: actor.id, resolvedAt: trx.fn.now(3) })
      const details = { noticeId, answerId, resolution }
      await recordAudit(trx, {
        caseId,
        actorId: actor.id,
        kind: 'notice.objection_resolved',
        details,
      })
    })
    return one(db, caseId, noticeId)
  }

  async function period(db: Knex, caseId: number): Promise<number> {
    const row = (await db('cases').where({ id: caseId }).first('noticePeriodDays')) as {
      noticePeriodDays: number
    }
    return row.noticePeriodDays
  }

  /** Sets the case's notice period; notices already sent keep the date they gave. */
  async function setPeriod({ actor, db }: ServiceContext, caseId: number, days: number) {
    await db.transaction(async (trx) => {
      const from = await period(trx, caseId)
      if (from === days) return
      await trx('cases').where({ id: caseId }).update({ noticePeriodDays: days })
      const details = { changes: { noticePeriodDays: { from, to: days } } }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'case.updated', details })
    })
    return period(db, caseId)
  }

  return { list, create, answer, resolve, period, setPeriod }
}

export type NoticeService = ReturnType<typeof createNoticeService>
