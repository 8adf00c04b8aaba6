import { PERSONAL_NOTICE_KINDS } from '../../../shared/schemas/notice-settings'

/** The part someone was given on a case; each gets its own "you were assigned" notice. */
export type AssignedPart = 'lead' | 'lab' | 'reviewer'

/**
 * What happened, as the action that causes a notice names it. Recipients are never given here:
 * `queueNotice` finds them in the product's own records (people, the case, the notice's parties).
 */
export type Notice =
  /** to the person now holding the part */
  | { kind: 'assigned'; caseId: number; personId: number; part: AssignedPart }
  /** to the case's reviewer */
  | { kind: 'review_requested'; caseId: number }
  /** to the case's lead investigator */
  | { kind: 'revisions_requested'; caseId: number; reason: string }
  /** to the case's lead investigator */
  | { kind: 'approved'; caseId: number }
  /** to the active people of the case's client organisation; essential */
  | { kind: 'report_issued'; caseId: number; reportNumber: string }
  /** to the case's lead investigator */
  | { kind: 'client_question'; caseId: number; askedById: number; question: string }
  /** to the person who asked */
  | { kind: 'answer'; caseId: number; askedById: number; answer: string }
  /** to the interested parties the notice went to (those with an e-mail address) */
  | { kind: 'destructive_testing_notice'; caseId: number; noticeId: number }

export type NoticeKind = Notice['kind']

/** Every kind: those people receive (and may choose), and the notice to outside parties. */
export const NOTICE_KINDS = [
  ...PERSONAL_NOTICE_KINDS,
  'destructive_testing_notice',
] as const satisfies readonly NoticeKind[]

/** One recipient, from a people record or a party named on the case. */
export interface Recipient {
  personId: number | null
  name: string
  address: string
}

/** Everything a message says, captured when it is queued, so it tells what was true then. */
export interface NoticeFacts {
  caseId: number
  caseNumber: string
  caseTitle: string
  recipientName: string
  part?: AssignedPart
  reason?: string
  reportNumber?: string
  askedByName?: string
  question?: string
  answer?: string
  plannedWork?: string
  plannedOn?: string
  respondBy?: string
}

/** What the outbox stores in `payload`. */
export interface StoredNotice {
  kind: NoticeKind
  facts: NoticeFacts
}
