import type { Turnaround } from '../shared/schemas/case-vocabulary'
import type { CaseState, ClientStage } from '../shared/workflow/case-states'

// Words and colours shown for coded values, kept in one place so every screen says the same.
// Labels of states, roles and the case vocabulary sit beside their definitions in shared/.

type TagSeverity = 'secondary' | 'info' | 'success' | 'warn' | 'danger' | 'contrast'

/** Tag colours: work in hand is calm, waiting on someone is amber, finished is green. */
export const CASE_STATE_SEVERITIES: Record<CaseState, TagSeverity> = {
  intake: 'secondary',
  examination: 'info',
  drafting: 'info',
  in_review: 'warn',
  revisions_requested: 'warn',
  approved: 'success',
  issued: 'success',
  closed: 'contrast',
}

export const CLIENT_STAGE_SEVERITIES: Record<ClientStage, TagSeverity> = {
  received: 'secondary',
  under_examination: 'info',
  report_in_preparation: 'info',
  report_issued: 'success',
  closed: 'contrast',
}

export const TURNAROUND_SEVERITIES: Record<Turnaround, TagSeverity | undefined> = {
  standard: undefined,
  expedited: 'info',
  rush: 'warn',
}

export const NOT_GIVEN = '—'
