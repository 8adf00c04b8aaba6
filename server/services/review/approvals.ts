import type { Knex } from 'knex'
import type { Approval } from '../../../shared/schemas/review'

interface ApprovalRow {
  id: number
  approverId: number
  approverName: string
  approvedAt: Date
  contentSha256: string
}

/** The approval standing now: the latest, neither withdrawn by an edit nor used by an issue. */
export async function currentApprovalRow(db: Knex, caseId: number, forUpdate = false) {
  const query = db('approvals')
    .join('users', 'users.id', 'approvals.approverId')
    .where({ 'approvals.caseId': caseId })
    .whereNull('approvals.withdrawnAt')
    .whereNull('approvals.reportId')
    .orderBy('approvals.id', 'desc')
    .select('approvals.*', 'users.name as approverName')
  if (forUpdate) query.forUpdate()
  return (await query.first()) as ApprovalRow | undefined
}

export async function currentApproval(db: Knex, caseId: number): Promise<Approval | null> {
  const row = await currentApprovalRow(db, caseId)
  if (!row) return null
  return {
    approverId: row.approverId,
    approverName: row.approverName,
    approvedAt: row.approvedAt.toISOString(),
    contentSha256: row.contentSha256,
  }
}

/** An edit of the approved draft: the approval standing now is withdrawn, kept in the record. */
export async function withdrawCurrentApproval(trx: Knex, caseId: number, personId: number) {
  await trx('approvals')
    .where({ caseId })
    .whereNull('withdrawnAt')
    .whereNull('reportId')
    .update({ withdrawnAt: trx.fn.now(3), withdrawnBy: personId })
}
