import { z } from 'zod/mini'
import { SECTION_KEYS, type SectionKey } from '../findings/sections'
import { Id, optionalText, trimmed } from './common'

/**
 * A review comment: anchored to a section of the draft (its key) and, for a passage, the quoted
 * text; a reply names the comment it answers and takes its anchor.
 */
export const ReviewCommentCreate = z.strictObject({
  body: trimmed(5000, 'The comment'),
  sectionKey: z.optional(
    z.nullable(z.enum(SECTION_KEYS, { error: 'Choose a section of the draft.' })),
  ),
  quote: z.optional(optionalText(2000, 'The quoted passage')),
  parentId: z.optional(z.nullable(Id)),
})
export type ReviewCommentCreate = z.output<typeof ReviewCommentCreate>

export const CommentParams = z.looseObject({ commentId: Id })

export const RevisionRequest = z.strictObject({
  reason: trimmed(5000, 'The reason for the revisions'),
})
export type RevisionRequest = z.output<typeof RevisionRequest>

export interface ReviewComment {
  id: number
  parentId: number | null
  authorId: number
  authorName: string
  sectionKey: SectionKey | null
  quote: string | null
  body: string
  createdAt: string
  resolvedAt: string | null
  resolvedByName: string | null
}

export interface Approval {
  approverId: number
  approverName: string
  approvedAt: string
  /** SHA-256 of the canonical JSON of the exact content approved */
  contentSha256: string
}

/** One step of the review as the activity recorded it. */
export interface ReviewStep {
  kind:
    'submitted' | 'revisions_requested' | 'approved' | 'approval_withdrawn' | 'issued' | 'amended'
  actorName: string | null
  at: string
  reason: string | null
}

export interface ReviewView {
  /** the approval standing now, or null */
  approval: Approval | null
  /** everyone the four-eyes rule keeps from approving: authors, lead and co-investigators */
  authorIds: number[]
  history: ReviewStep[]
}
