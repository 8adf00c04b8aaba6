import type { Mechanism } from './case-vocabulary'
import type { CaseSummary, ClientCaseView } from './cases'
import type { CaseState } from '../workflow/case-states'

/** The lists a home page can show; each person gets those of their roles. */
export const DASHBOARD_LISTS = [
  'myOpen',
  'overdue',
  'dueThisWeek',
  'awaitingMyReview',
  'awaitingLab',
  'ourOpen',
  'recentlyIssued',
] as const
export type DashboardListKey = (typeof DASHBOARD_LISTS)[number]

export const DASHBOARD_LIST_TITLES: Record<DashboardListKey, string> = {
  myOpen: 'My open cases',
  overdue: 'Overdue',
  dueThisWeek: 'Due this week',
  awaitingMyReview: 'Waiting for my review',
  awaitingLab: 'Waiting for the lab',
  ourOpen: 'Your open cases',
  recentlyIssued: 'Recently issued',
}

export interface DashboardList {
  key: DashboardListKey
  cases: (CaseSummary | ClientCaseView)[]
}

export interface Dashboard {
  lists: DashboardList[]
  /** open and finished cases in the person's scope, by state (staff only) */
  byState: { state: CaseState; count: number }[]
  /** cases by their primary failure mechanism (staff only) */
  byMechanism: { mechanism: Mechanism; count: number }[]
}
