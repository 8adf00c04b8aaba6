import type { Role } from '../schemas/roles'
import type { CaseState } from '../workflow/case-states'

/** Who is asking: enough of the signed-in person to decide. */
export interface Actor {
  id: number
  roles: readonly Role[]
  organisationId: number | null
}

/** Enough of a case to decide: its owner organisation, its state and the people on it. */
export interface CaseRef {
  organisationId: number
  status: CaseState
  leadInvestigatorId: number | null
  coInvestigatorIds: readonly number[]
  labTechnicianId: number | null
  reviewerId: number | null
}

export type GlobalAction =
  | 'people.manage'
  /** read the security trail (sign-ins, refusals, changes of people) */
  | 'security.audit'
  | 'organisations.manage'
  | 'organisations.list'
  | 'staff.list'
  | 'cases.list'
  | 'case.create'
  /** read the specification library */
  | 'specifications.list'
  /** add and change specification records, and record their check against the edition */
  | 'specifications.manage'
  /** see the outbox and resend, and (demo mode) read what the local SMTP server received */
  | 'mail.manage'
  /** read the laboratory's name and address, as reports print them */
  | 'settings.read'
  /** change the laboratory's name and address */
  | 'settings.manage'

export type CaseAction =
  /** see that the case exists (a client: as a plain status line) */
  | 'case.view'
  /** see the whole case record, internal fields and people included */
  | 'case.viewInternal'
  /** change the case record, its classification, people and interested parties */
  | 'case.edit'
  /** make the plain status changes of the state table */
  | 'case.changeStatus'
  | 'case.viewActivity'
  /** add, change and remove service-history events and their documents */
  | 'case.editHistory'
  /** register samples, record custody events, notices and their answers, and observations */
  | 'case.handleEvidence'
  /** place a legal hold on the case or one of its items */
  | 'case.placeHold'
  /** release a legal hold, record the resolution of an objection to destructive work */
  | 'case.releaseEvidence'
  /** upload photographs, describe, calibrate and mark them */
  | 'case.editPhotos'
  /** add specimens, upload raw test records, recompute and invalidate unconfirmed records */
  | 'case.recordTests'
  /** confirm a test record, after which it is read-only */
  | 'case.confirmTests'
  /** read the findings draft (staff only: clients read issued reports, never drafts) */
  | 'case.readFindings'
  /** write the findings draft */
  | 'case.editFindings'
  /** submit the draft for review (or resubmit after revisions) */
  | 'case.submitForReview'
  /** write and resolve review comments */
  | 'case.comment'
  /** approve the draft or ask for revisions (the assigned reviewer; four eyes checked on top) */
  | 'case.decideReview'
  /** issue the approved draft as the next revision of the report */
  | 'case.issue'
  /** start an amendment of an issued report, with its reason */
  | 'case.amend'
  /** read the case's issued report revisions */
  | 'case.readReports'
  /** acknowledge receipt of an issued report (a client of the case) */
  | 'case.acknowledgeReport'
  /** ask a question on an issued report (a client of the case) */
  | 'case.askQuestion'
  /** answer the client's questions on a report */
  | 'case.answerQuestions'

export type Action = GlobalAction | CaseAction

export const STAFF_ROLES: readonly Role[] = ['admin', 'investigator', 'lab', 'reviewer']

export const isStaff = (actor: Actor) => actor.roles.some((role) => STAFF_ROLES.includes(role))
const holds = (actor: Actor, ...roles: Role[]) => actor.roles.some((role) => roles.includes(role))

/** Which roles may take each action at all; the case-level rules below narrow it down. */
const ROLE_RULES: Record<Action, readonly Role[]> = {
  'people.manage': ['admin'],
  'security.audit': ['admin'],
  'organisations.manage': ['admin'],
  'organisations.list': [...STAFF_ROLES, 'client'],
  'staff.list': STAFF_ROLES,
  'cases.list': [...STAFF_ROLES, 'client'],
  'case.create': ['admin', 'investigator'],
  'case.view': [...STAFF_ROLES, 'client'],
  'case.viewInternal': STAFF_ROLES,
  'case.edit': ['admin', 'investigator'],
  'case.changeStatus': ['admin', 'investigator'],
  'case.viewActivity': STAFF_ROLES,
  'case.editHistory': ['admin', 'investigator'],
  'case.handleEvidence': ['admin', 'investigator', 'lab'],
  'case.placeHold': ['admin', 'investigator'],
  'case.releaseEvidence': ['admin'],
  'case.editPhotos': ['admin', 'investigator', 'lab'],
  'specifications.list': STAFF_ROLES,
  'specifications.manage': ['admin'],
  'mail.manage': ['admin'],
  'settings.read': STAFF_ROLES,
  'settings.manage': ['admin'],
  'case.recordTests': ['admin', 'investigator', 'lab'],
  'case.confirmTests': ['admin', 'lab'],
  'case.readFindings': STAFF_ROLES,
  'case.editFindings': ['admin', 'investigator'],
  'case.submitForReview': ['admin', 'investigator'],
  'case.comment': ['admin', 'investigator', 'reviewer'],
  'case.decideReview': ['reviewer'],
  'case.issue': ['admin', 'investigator'],
  'case.amend': ['admin', 'investigator'],
  'case.readReports': [...STAFF_ROLES, 'client'],
  'case.acknowledgeReport': ['client'],
  'case.askQuestion': ['client'],
  'case.answerQuestions': ['admin', 'investigator'],
}

/** The person's parts in a case: lead, co-investigator, lab technician, reviewer. */
export function partsIn(actor: Actor, caseRef: CaseRef) {
  return {
    lead: caseRef.leadInvestigatorId === actor.id,
    coInvestigator: caseRef.coInvestigatorIds.includes(actor.id),
    lab: caseRef.labTechnicianId === actor.id,
    reviewer: caseRef.reviewerId === actor.id,
  }
}

/** The states in which the findings draft is open for writing (an approved one reopens). */
export const FINDINGS_EDITABLE_STATES: readonly CaseState[] = [
  'examination',
  'drafting',
  'revisions_requested',
  'approved',
]

/** The case's own investigators write its findings, and only while a draft is being worked on. */
function findingsEditor(actor: Actor, caseRef: CaseRef): boolean {
  const parts = partsIn(actor, caseRef)
  return (parts.lead || parts.coInvestigator) && FINDINGS_EDITABLE_STATES.includes(caseRef.status)
}

/** What a client of the case's organisation may do: see it, read, acknowledge and ask. */
const CLIENT_ACTIONS: readonly CaseAction[] = [
  'case.view',
  'case.readReports',
  'case.acknowledgeReport',
  'case.askQuestion',
]

/** States in which the review conversation is open. */
export const REVIEW_COMMENT_STATES: readonly CaseState[] = [
  'drafting',
  'in_review',
  'revisions_requested',
  'approved',
]

/**
 * Review, issue and reports: the lead submits, issues, amends and answers (or an administrator);
 * the assigned reviewer decides; the people on the case comment. Amending and answering go on
 * after a case is closed. `undefined` for actions this rule does not cover.
 */
function reviewRule(actor: Actor, action: CaseAction, caseRef: CaseRef): boolean | undefined {
  const parts = partsIn(actor, caseRef)
  const leads = parts.lead || holds(actor, 'admin')
  const state = caseRef.status
  switch (action) {
    case 'case.readReports':
      return true
    case 'case.submitForReview':
      return leads && (state === 'drafting' || state === 'revisions_requested')
    case 'case.comment':
      return (
        (leads || parts.coInvestigator || parts.reviewer) && REVIEW_COMMENT_STATES.includes(state)
      )
    case 'case.decideReview':
      return parts.reviewer && state === 'in_review'
    case 'case.issue':
      return leads && state === 'approved'
    case 'case.amend':
      return leads && (state === 'issued' || state === 'closed')
    case 'case.answerQuestions':
      return leads
    case 'case.acknowledgeReport':
    case 'case.askQuestion':
      return false
    default:
      return undefined
  }
}

/**
 * The lead investigator (or, while a case has no lead, any investigator, so one can take it on)
 * and administrators keep the record; co-investigators may also move it along. Nothing changes
 * once a case is closed.
 */
function caseRule(actor: Actor, action: CaseAction, caseRef: CaseRef): boolean {
  if (!isStaff(actor)) {
    return (
      CLIENT_ACTIONS.includes(action) &&
      actor.organisationId !== null &&
      actor.organisationId === caseRef.organisationId
    )
  }
  if (action === 'case.view' || action === 'case.viewInternal') return true
  const review = reviewRule(actor, action, caseRef)
  if (review !== undefined) return review
  if (action === 'case.viewActivity' || action === 'case.readFindings') return true
  if (action === 'case.editFindings') return findingsEditor(actor, caseRef)
  if (caseRef.status === 'closed') return false
  if (holds(actor, 'admin')) return true
  const parts = partsIn(actor, caseRef)
  const unled = caseRef.leadInvestigatorId === null && holds(actor, 'investigator')
  if (action === 'case.recordTests') return parts.lab || parts.lead
  if (action === 'case.confirmTests') return parts.lab
  if (action === 'case.edit' || action === 'case.placeHold') return parts.lead || unled
  // the case's lab technician handles its samples as much as the investigators do
  if (action === 'case.handleEvidence')
    return parts.lead || parts.coInvestigator || parts.lab || unled
  // the case's lab technician takes many of the photographs
  if (action === 'case.editPhotos') return parts.lead || parts.coInvestigator || parts.lab || unled
  return parts.lead || parts.coInvestigator || unled
}

/**
 * The one answer to "may this person do that (to this case)?", asked by the server's routes and
 * by the client to decide which pages and buttons to show. Without a case, a case action answers
 * whether the person's roles could take it on some case.
 */
export function can(actor: Actor, action: Action, caseRef?: CaseRef): boolean {
  if (!holds(actor, ...ROLE_RULES[action])) return false
  if (!caseRef) return true
  if (!(action in CASE_ACTIONS)) return true
  return caseRule(actor, action as CaseAction, caseRef)
}

const CASE_ACTIONS: Record<CaseAction, true> = {
  'case.view': true,
  'case.viewInternal': true,
  'case.edit': true,
  'case.changeStatus': true,
  'case.viewActivity': true,
  'case.editHistory': true,
  'case.handleEvidence': true,
  'case.placeHold': true,
  'case.releaseEvidence': true,
  'case.editPhotos': true,
  'case.recordTests': true,
  'case.confirmTests': true,
  'case.readFindings': true,
  'case.editFindings': true,
  'case.submitForReview': true,
  'case.comment': true,
  'case.decideReview': true,
  'case.issue': true,
  'case.amend': true,
  'case.readReports': true,
  'case.acknowledgeReport': true,
  'case.askQuestion': true,
  'case.answerQuestions': true,
}

/** The organisation a person's lists are limited to: none for staff, their own for a client. */
export function organisationScope(actor: Actor): number | undefined {
  if (isStaff(actor)) return undefined
  return actor.organisationId ?? -1
}
