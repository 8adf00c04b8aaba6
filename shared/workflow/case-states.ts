import type { Role } from '../schemas/roles'

export const CASE_STATES = [
  'intake',
  'examination',
  'drafting',
  'in_review',
  'revisions_requested',
  'approved',
  'issued',
  'closed',
] as const
export type CaseState = (typeof CASE_STATES)[number]

export const CASE_STATE_LABELS: Record<CaseState, string> = {
  intake: 'Intake',
  examination: 'Examination',
  drafting: 'Drafting',
  in_review: 'In review',
  revisions_requested: 'Revisions requested',
  approved: 'Approved',
  issued: 'Issued',
  closed: 'Closed',
}

/**
 * How a transition is made: `direct` ones are a plain status change by the listed roles; the
 * others belong to the review, issue and amend actions and are refused as plain status changes.
 */
export type TransitionRoute = 'direct' | 'review' | 'issue' | 'amend'

export interface Transition {
  from: CaseState
  to: CaseState
  roles: readonly Role[]
  route: TransitionRoute
}

const LEADS = ['admin', 'investigator'] as const

export const CASE_TRANSITIONS: readonly Transition[] = [
  { from: 'intake', to: 'examination', roles: LEADS, route: 'direct' },
  { from: 'examination', to: 'drafting', roles: LEADS, route: 'direct' },
  { from: 'drafting', to: 'in_review', roles: LEADS, route: 'review' },
  { from: 'in_review', to: 'revisions_requested', roles: ['reviewer'], route: 'review' },
  { from: 'revisions_requested', to: 'in_review', roles: LEADS, route: 'review' },
  { from: 'in_review', to: 'approved', roles: ['reviewer'], route: 'review' },
  { from: 'approved', to: 'issued', roles: LEADS, route: 'issue' },
  { from: 'issued', to: 'closed', roles: LEADS, route: 'direct' },
  // an amendment, with its reason, is the only way back to a draft (ISO/IEC 17025 7.8.8)
  { from: 'issued', to: 'drafting', roles: LEADS, route: 'amend' },
  { from: 'closed', to: 'drafting', roles: LEADS, route: 'amend' },
]

export function findTransition(from: CaseState, to: CaseState): Transition | undefined {
  return CASE_TRANSITIONS.find((transition) => transition.from === from && transition.to === to)
}

export type TransitionCheck =
  | { allowed: true; transition: Transition }
  | { allowed: false; reason: 'no_such_transition' | 'role' | 'route' }

/** Whether someone with these roles may move a case from one state to another along `route`. */
export function checkTransition(
  from: CaseState,
  to: CaseState,
  roles: readonly Role[],
  route: TransitionRoute = 'direct',
): TransitionCheck {
  const transition = findTransition(from, to)
  if (!transition) return { allowed: false, reason: 'no_such_transition' }
  if (transition.route !== route) return { allowed: false, reason: 'route' }
  if (!roles.some((role) => transition.roles.includes(role)))
    return { allowed: false, reason: 'role' }
  return { allowed: true, transition }
}

export function nextStates(from: CaseState, roles: readonly Role[]): CaseState[] {
  return CASE_TRANSITIONS.filter(
    (transition) =>
      transition.from === from &&
      transition.route === 'direct' &&
      roles.some((role) => transition.roles.includes(role)),
  ).map((transition) => transition.to)
}

/** What a client is told about a case: plain stages, no internal states. */
export const CLIENT_STAGES = [
  'received',
  'under_examination',
  'report_in_preparation',
  'report_issued',
  'closed',
] as const
export type ClientStage = (typeof CLIENT_STAGES)[number]

export const CLIENT_STAGE_LABELS: Record<ClientStage, string> = {
  received: 'Received',
  under_examination: 'Under examination',
  report_in_preparation: 'Report in preparation',
  report_issued: 'Report issued',
  closed: 'Closed',
}

const STAGE_OF_STATE: Record<CaseState, ClientStage> = {
  intake: 'received',
  examination: 'under_examination',
  drafting: 'report_in_preparation',
  in_review: 'report_in_preparation',
  revisions_requested: 'report_in_preparation',
  approved: 'report_in_preparation',
  issued: 'report_issued',
  closed: 'closed',
}

export function clientStageOf(state: CaseState): ClientStage {
  return STAGE_OF_STATE[state]
}

/** The internal states a client stage stands for, to filter a client's list by stage. */
export function statesOfStage(stage: ClientStage): CaseState[] {
  return CASE_STATES.filter((state) => STAGE_OF_STATE[state] === stage)
}
