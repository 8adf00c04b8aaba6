import type { Priority } from '../shared/schemas/cases'
import type { CaseState } from '../shared/workflow/case-states'

// Words shown to people for coded values, kept in one place so every screen says the same.
// Case states and roles have their labels beside their definitions in shared/.

export const PRIORITY_LABELS: Record<Priority, string> = {
  low: 'Low',
  normal: 'Normal',
  high: 'High',
  urgent: 'Urgent',
}

type TagSeverity = 'secondary' | 'info' | 'success' | 'warn' | 'danger' | 'contrast'

/** Tag colours: work in hand is calm, waiting on someone is amber, finished is green. */
export const CASE_STATE_SEVERITIES: Record<CaseState, TagSeverity> = {
  intake: 'secondary',
  examination: 'info',
  drafting: 'info',
  in_review: 'warn',
  revisions_requested: 'danger',
  approved: 'success',
  released: 'success',
  closed: 'contrast',
}

export const PRIORITY_SEVERITIES: Record<Priority, TagSeverity | undefined> = {
  low: undefined,
  normal: undefined,
  high: 'warn',
  urgent: 'danger',
}

export const NOT_GIVEN = '—'
