import { z } from 'zod/mini'
import { idOf, IsoDate, optionalText, trimmed } from './common'

export const NOTICE_ANSWERS = ['agreed', 'will_attend', 'objected'] as const
export type NoticeAnswerKind = (typeof NOTICE_ANSWERS)[number]
export const NOTICE_ANSWER_LABELS: Record<NoticeAnswerKind, string> = {
  agreed: 'Agreed',
  will_attend: 'Will attend',
  objected: 'Objected',
}

export const NoticeCreate = z.strictObject({
  sampleIds: z
    .array(idOf('Choose the items the work is planned on.'))
    .check(
      z.minLength(1, 'Choose the items the work is planned on.'),
      z.maxLength(100, 'At most 100 items per notice.'),
    ),
  plannedWork: trimmed(4000, 'Planned work'),
  plannedOn: IsoDate,
  sentOn: IsoDate,
  authorisedBy: trimmed(191, 'Authorised by'),
})
export type NoticeCreate = z.output<typeof NoticeCreate>

export const NoticeAnswerCreate = z.strictObject({
  partyId: idOf('Choose the party who answered.'),
  answer: z.enum(NOTICE_ANSWERS, { error: 'Choose the answer.' }),
  answeredOn: IsoDate,
  comment: z._default(optionalText(4000, 'Comment'), null),
})
export type NoticeAnswerCreate = z.output<typeof NoticeAnswerCreate>

export const ObjectionResolution = z.strictObject({
  resolution: trimmed(4000, 'Resolution'),
})

export interface NoticeAnswer {
  id: number
  partyId: number
  answer: NoticeAnswerKind
  answeredOn: string
  comment: string | null
  resolution: string | null
  resolvedAt: string | null
  createdAt: string
}

export interface NoticeParty {
  id: number
  name: string
  organisation: string | null
  email: string | null
  role: string
}

export type NoticeStanding =
  /** every party agreed (or will attend) */
  | 'agreed'
  /** the period passed with no open objection */
  | 'period_passed'
  /** a party objected and no administrator has recorded a resolution */
  | 'objected'
  /** still waiting for answers within the period */
  | 'waiting'

export interface Notice {
  id: number
  caseId: number
  sampleIds: number[]
  plannedWork: string
  plannedOn: string
  sentOn: string
  respondBy: string
  authorisedBy: string
  parties: NoticeParty[]
  answers: NoticeAnswer[]
  standing: NoticeStanding
  createdAt: string
}

export const NoticePeriod = z.strictObject({
  days: z
    .int({ error: 'The notice period is a whole number of days.' })
    .check(
      z.minimum(0, 'The notice period cannot be negative.'),
      z.maximum(365, 'The notice period is at most 365 days.'),
    ),
})
export type NoticePeriod = z.output<typeof NoticePeriod>
