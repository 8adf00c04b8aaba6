import { z } from 'zod/mini'
import type { FindingsDocument } from '../findings/document'
import type { LiveBlockSnapshots } from '../findings/live-blocks'
import { Id, trimmed } from './common'

export const AmendmentRequest = z.strictObject({
  reason: trimmed(5000, 'The reason for the amendment'),
})
export type AmendmentRequest = z.output<typeof AmendmentRequest>

export const ReportQuestionCreate = z.strictObject({ body: trimmed(5000, 'The question') })
export type ReportQuestionCreate = z.output<typeof ReportQuestionCreate>

export const ReportAnswerCreate = z.strictObject({ body: trimmed(5000, 'The answer') })
export type ReportAnswerCreate = z.output<typeof ReportAnswerCreate>

export const ReportParams = z.looseObject({ reportId: Id })
export const QuestionParams = z.looseObject({ reportId: Id, questionId: Id })
export const FigureParams = z.looseObject({
  reportId: Id,
  figureId: z.string().check(z.regex(/^[A-Za-z0-9_-]{1,64}$/, 'No such figure.')),
})

/** One issued revision as a list shows it. */
export interface ReportSummary {
  id: number
  caseId: number
  /** `<case number>-R` */
  number: string
  revision: string
  issuedAt: string
  issuedByName: string
  approvedAt: string
  approvedByName: string
  /** the revision this one replaces, and why (an amendment) */
  replaces: { id: number; revision: string } | null
  amendmentReason: string | null
  /** a later revision replaces this one */
  supersededBy: { id: number; revision: string } | null
  contentSha256: string
  /** when the asking person acknowledged it, or null */
  acknowledgedAt: string | null
}

export interface ReportAcknowledgement {
  personName: string
  acknowledgedAt: string
}

export interface ReportAnswer {
  id: number
  body: string
  answeredByName: string
  answeredAt: string
}

export interface ReportQuestion {
  id: number
  body: string
  askedByName: string
  askedAt: string
  answers: ReportAnswer[]
}

/** One revision with its frozen content, checked against its hashes as it was served. */
export interface ReportView extends ReportSummary {
  caseNumber: string
  caseTitle: string
  doc: FindingsDocument
  html: string
  liveBlocks: LiveBlockSnapshots
  figures: { figureId: string; sha256: string; size: number }[]
  /** SHA-256 of the stored revision as a whole (content, figures, who and when) */
  rowSha256: string
  acknowledgements: ReportAcknowledgement[]
  questions: ReportQuestion[]
}

/** Revision letters: A … Z, then AA, AB … */
export function revisionLetter(index: number): string {
  let n = index
  let letters = ''
  do {
    letters = String.fromCharCode(65 + (n % 26)) + letters
    n = Math.floor(n / 26) - 1
  } while (n >= 0)
  return letters
}

export const reportNumberOf = (caseNumber: string) => `${caseNumber}-R`

/** A revision in the reading room's list, with the case it belongs to. */
export type ReadableReport = ReportSummary & { caseNumber: string; caseTitle: string }
