import { z } from 'zod/mini'

/**
 * The notices that go to people of the product, each of whom may choose which they receive.
 * (A notice of destructive testing goes to the case's interested parties, who are not people
 * of the product and have no settings.)
 */
export const PERSONAL_NOTICE_KINDS = [
  'assigned',
  'review_requested',
  'revisions_requested',
  'approved',
  'client_question',
  'report_issued',
  'answer',
] as const
export type PersonalNoticeKind = (typeof PERSONAL_NOTICE_KINDS)[number]

/** A client must learn that a report was issued to them: nobody can turn that notice off. */
export const ESSENTIAL_NOTICE_KINDS: readonly string[] = ['report_issued']

export const isEssentialNotice = (kind: string): boolean => ESSENTIAL_NOTICE_KINDS.includes(kind)

/** Who receives each kind: staff for the case's work, clients for their reports. */
export const NOTICE_AUDIENCE: Record<PersonalNoticeKind, 'staff' | 'client'> = {
  assigned: 'staff',
  review_requested: 'staff',
  revisions_requested: 'staff',
  approved: 'staff',
  client_question: 'staff',
  report_issued: 'client',
  answer: 'client',
}

/** How a settings page names each kind, in the reader's words. */
export const NOTICE_KIND_LABELS: Record<PersonalNoticeKind, string> = {
  assigned: 'You were given a part on a case (lead, lab technician or reviewer)',
  review_requested: 'A report waits for your review',
  revisions_requested: 'Your reviewer asked for revisions',
  approved: 'Your report was approved',
  client_question: 'A client asked a question about your report',
  report_issued: 'A report was issued to your organisation',
  answer: 'Your question about a report was answered',
}

export const NoticeSettingsUpdate = z.strictObject({
  off: z
    .array(z.enum(PERSONAL_NOTICE_KINDS, { error: 'Unknown kind of notice.' }), {
      error: 'Give the notices to turn off as a list.',
    })
    .check(
      z.maxLength(PERSONAL_NOTICE_KINDS.length, 'The list names a notice more than once.'),
      z.refine((kinds) => !kinds.some(isEssentialNotice), {
        error: 'The notice of an issued report is essential and cannot be turned off.',
      }),
    ),
})
export type NoticeSettingsUpdate = z.output<typeof NoticeSettingsUpdate>

/** One line of a person's notice settings. */
export interface NoticeSetting {
  kind: PersonalNoticeKind
  label: string
  essential: boolean
  on: boolean
}
