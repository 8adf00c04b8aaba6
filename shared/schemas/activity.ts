import { z } from 'zod/mini'
import { Id, PageQuery } from './common'

/** Kinds of activity a case records; features add their own as they land. */
export const ACTIVITY_KINDS = [
  'case.created',
  'case.updated',
  'case.status_changed',
  'case.assigned',
  'case.classified',
  'service_event.added',
  'service_event.changed',
  'service_event.removed',
  'attachment.added',
  'sample.received',
  'sample.sectioned',
  'custody_event.added',
  'notice.recorded',
  'notice.answered',
  'notice.objection_resolved',
  'hold.placed',
  'hold.released',
  'observation.recorded',
  'observation.withdrawn',
  'photo.added',
  'photo.changed',
  'specimen.added',
  'tensile_record.added',
  'tensile_record.recomputed',
  'tensile_record.revised',
  'tensile_record.invalidated',
  'tensile_record.confirmed',
  'findings.edited',
  'findings.approval_withdrawn',
  'hardness.recorded',
  'review.submitted',
  'review.commented',
  'review.comment_resolved',
  'review.revisions_requested',
  'review.approved',
  'report.issued',
  'case.amended',
  'report.acknowledged',
  'report.question_asked',
  'report.question_answered',
  'report.integrity_failed',
] as const
export type ActivityKind = (typeof ACTIVITY_KINDS)[number]

export const ACTIVITY_KIND_LABELS: Record<ActivityKind, string> = {
  'case.created': 'Case opened',
  'case.updated': 'Record edited',
  'case.status_changed': 'Status changed',
  'case.assigned': 'People assigned',
  'case.classified': 'Classification changed',
  'service_event.added': 'Service event added',
  'service_event.changed': 'Service event changed',
  'service_event.removed': 'Service event removed',
  'attachment.added': 'Document attached',
  'sample.received': 'Sample received',
  'sample.sectioned': 'Sample sectioned',
  'custody_event.added': 'Custody event recorded',
  'notice.recorded': 'Notice of testing recorded',
  'notice.answered': 'Answer to a notice recorded',
  'notice.objection_resolved': 'Objection resolved',
  'hold.placed': 'Legal hold placed',
  'hold.released': 'Legal hold released',
  'observation.recorded': 'Observation recorded',
  'observation.withdrawn': 'Observation withdrawn',
  'photo.added': 'Photo added',
  'photo.changed': 'Photo changed',
  'specimen.added': 'Specimen added',
  'tensile_record.added': 'Tensile record uploaded',
  'tensile_record.recomputed': 'Tensile record recomputed',
  'findings.edited': 'Findings edited',
  'hardness.recorded': 'Hardness readings recorded',
  'findings.approval_withdrawn': 'Approval withdrawn by an edit',
  'review.submitted': 'Submitted for review',
  'review.commented': 'Review comment written',
  'review.comment_resolved': 'Review comment resolved',
  'review.revisions_requested': 'Revisions requested',
  'review.approved': 'Findings approved',
  'report.issued': 'Report revision issued',
  'case.amended': 'Amendment started',
  'report.acknowledged': 'Report acknowledged by the client',
  'report.question_asked': 'Question from the client',
  'report.question_answered': 'Question answered',
  'report.integrity_failed': 'Report failed its integrity check',
  'tensile_record.revised': 'Confirmed tensile record revised',
  'tensile_record.invalidated': 'Tensile record marked invalid',
  'tensile_record.confirmed': 'Tensile record confirmed',
}

export const ActivityQuery = z.strictObject({
  ...PageQuery,
  actorId: z.optional(Id),
  kind: z.optional(z.enum(ACTIVITY_KINDS, { error: 'Choose a kind of activity from the list.' })),
})
export type ActivityQuery = z.output<typeof ActivityQuery>

/** One field's value before and after an edit. */
export interface FieldChange {
  from: unknown
  to: unknown
}

export interface ActivityEntry {
  id: number
  at: string
  actorId: number | null
  actorName: string | null
  kind: ActivityKind
  /** for edits: `{ changes: { field: { from, to } } }`; for status changes: `{ from, to }` */
  details: Record<string, unknown> | null
}
