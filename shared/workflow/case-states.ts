import type { Role } from '../schemas/roles'

export const CASE_STATES = [
  'intake',
  'examination',
  'drafting',
  'in_review',
  'revisions_requested',
  'approved',
  'released',
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
  released: 'Released',
  closed: 'Closed',
}

/**
 * How a transition is made: `direct` ones are a plain status change by the listed roles; the
 * others belong to the review and release actions and are refused as plain status changes.
 */
export type TransitionRoute = 'direct' | 'review' | 'release'

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
  { from: 'approved', to: 'released', roles: LEADS, route: 'release' },
  { from: 'released', to: 'closed', roles: LEADS, route: 'direct' },
  { from: 'released', to: 'drafting', roles: LEADS, route: 'direct' },
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
