import type { Knex } from 'knex'
import type { ReviewStep } from '../../../shared/schemas/review'

const STEPS: Record<string, ReviewStep['kind']> = {
  'review.submitted': 'submitted',
  'review.revisions_requested': 'revisions_requested',
  'review.approved': 'approved',
  'findings.approval_withdrawn': 'approval_withdrawn',
  'report.issued': 'issued',
  'case.amended': 'amended',
}

/** The review's steps as the activity recorded them, oldest first. */
export async function reviewHistory(db: Knex, caseId: number): Promise<ReviewStep[]> {
  const rows = (await db('audit_events')
    .leftJoin('users', 'users.id', 'audit_events.actorId')
    .where('audit_events.caseId', caseId)
    .whereIn('audit_events.action', Object.keys(STEPS))
    .orderBy('audit_events.id')
    .select(
      'audit_events.action',
      'audit_events.details',
      'audit_events.createdAt',
      'users.name as actorName',
    )) as { action: string; details: unknown; createdAt: Date; actorName: string | null }[]
  return rows.map((row) => {
    const details = (typeof row.details === 'string' ? JSON.parse(row.details) : row.details) as {
      reason?: string
      revision?: string
    } | null
    return {
      kind: STEPS[row.action] as ReviewStep['kind'],
      actorName: row.actorName,
      at: row.createdAt.toISOString(),
      reason: details?.reason ?? (details?.revision ? `Revision ${details.revision}` : null),
    }
  })
}
