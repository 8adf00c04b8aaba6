import type { AssignedPart, NoticeFacts, NoticeKind } from './notice-kinds'

/** What one message says, before it is laid out as plain text and HTML. */
export interface NoticeContent {
  subject: string
  paragraphs: string[]
  /** words someone wrote (a reason, a question, an answer), shown as a quotation */
  quote?: string
  /** path inside the product, joined to PUBLIC_URL */
  linkPath: string
  linkLabel: string
}

const PART_NAMES: Record<AssignedPart, string> = {
  lead: 'lead investigator',
  lab: 'lab technician',
  reviewer: 'reviewer',
}

const casePath = (facts: NoticeFacts, section = '') =>
  `/cases/${facts.caseId}${section ? `/${section}` : ''}`

const caseLine = (facts: NoticeFacts) => `case ${facts.caseNumber}, “${facts.caseTitle}”`

type Template = (facts: NoticeFacts) => NoticeContent

/** The user-facing words of every notice, kept together so they read alike. */
export const TEMPLATES: Record<NoticeKind, Template> = {
  assigned: (facts) => {
    const part = PART_NAMES[facts.part ?? 'lead']
    return {
      subject: `${facts.caseNumber}: you are the ${part} — ${facts.caseTitle}`,
      paragraphs: [`You were made the ${part} of ${caseLine(facts)}.`],
      linkPath: casePath(facts),
      linkLabel: 'Open the case',
    }
  },
  review_requested: (facts) => ({
    subject: `${facts.caseNumber}: review requested — ${facts.caseTitle}`,
    paragraphs: [`The report of ${caseLine(facts)} is ready for your review.`],
    linkPath: casePath(facts, 'review'),
    linkLabel: 'Review the report',
  }),
  revisions_requested: (facts) => ({
    subject: `${facts.caseNumber}: revisions requested — ${facts.caseTitle}`,
    paragraphs: [`The reviewer asked for revisions to the report of ${caseLine(facts)}.`],
    quote: facts.reason,
    linkPath: casePath(facts, 'review'),
    linkLabel: 'See the review',
  }),
  approved: (facts) => ({
    subject: `${facts.caseNumber}: report approved — ${facts.caseTitle}`,
    paragraphs: [`The reviewer approved the report of ${caseLine(facts)}. It can be issued.`],
    linkPath: casePath(facts, 'review'),
    linkLabel: 'Open the review',
  }),
  report_issued: (facts) => ({
    subject: `${facts.reportNumber}: report issued for case ${facts.caseNumber}`,
    paragraphs: [
      `Report ${facts.reportNumber} on ${caseLine(facts)} has been issued.`,
      'You can read it in Fractolog.',
    ],
    linkPath: casePath(facts),
    linkLabel: 'Open the case',
  }),
  client_question: (facts) => ({
    subject: `${facts.caseNumber}: question from ${facts.askedByName} — ${facts.caseTitle}`,
    paragraphs: [`${facts.askedByName} asked a question about ${caseLine(facts)}.`],
    quote: facts.question,
    linkPath: casePath(facts),
    linkLabel: 'Answer in Fractolog',
  }),
  answer: (facts) => ({
    subject: `${facts.caseNumber}: your question was answered — ${facts.caseTitle}`,
    paragraphs: [`Your question about ${caseLine(facts)} has an answer.`],
    quote: facts.answer,
    linkPath: casePath(facts),
    linkLabel: 'Open the case',
  }),
  destructive_testing_notice: (facts) => ({
    subject: `${facts.caseNumber}: notice of destructive testing on ${facts.plannedOn}`,
    paragraphs: [
      `The laboratory plans destructive work on evidence of ${caseLine(facts)} ` +
        `on ${facts.plannedOn}.`,
      `If you wish to attend or to object, answer the laboratory by ${facts.respondBy}.`,
    ],
    quote: facts.plannedWork,
    linkPath: casePath(facts, 'evidence/notices'),
    linkLabel: 'The notice in Fractolog',
  }),
}
