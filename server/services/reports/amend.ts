import { recordAudit } from '../audit'
import { findCase } from '../cases/case-record'
import type { ServiceContext } from '../context'
import { guardAction } from '../review/guard'
import { AppError } from '../../errors'

/**
 * issued or closed → drafting, with a reason (ISO/IEC 17025 7.8.8): the new draft starts from the
 * text of the latest revision, which the next issue names as the one it replaces.
 */
export async function amendReport({ actor, db }: ServiceContext, caseId: number, reason: string) {
  await db.transaction(async (trx) => {
    const record = await findCase(trx, caseId, undefined, { forUpdate: true })
    guardAction(actor, 'case.amend', record, ['issued', 'closed'])
    const latest = (await trx('reports').where({ caseId }).orderBy('id', 'desc').first()) as
      { id: number; revision: string; doc: string } | undefined
    if (!latest)
      throw new AppError('invalid_transition', 'There is no issued report to amend.', {
        from: record.status,
      })
    await trx('amendments').insert({
      caseId,
      replacesReportId: latest.id,
      reason,
      requestedBy: actor.id,
    })
    const findings = (await trx('findings').where({ caseId }).forUpdate().first('version')) as
      { version: number } | undefined
    await trx('findings')
      .where({ caseId })
      .update({
        doc: latest.doc,
        version: (findings?.version ?? 0) + 1,
        updatedBy: actor.id,
        updatedAt: trx.fn.now(3),
      })
    await trx('cases')
      .where({ id: caseId })
      .update({ status: 'drafting', version: record.version + 1, updatedAt: trx.fn.now() })
    const details = { from: record.status, to: 'drafting', reason, replaces: latest.revision }
    await recordAudit(trx, { caseId, actorId: actor.id, kind: 'case.amended', details })
  })
}
