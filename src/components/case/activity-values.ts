import { NOT_GIVEN } from '@/labels'
import {
  DECISION_RULE_LABELS,
  MECHANISM_LABELS,
  ROOT_CAUSE_LABELS,
  TURNAROUND_LABELS,
  type DecisionRule,
  type RootCause,
  type Turnaround,
} from '../../../shared/schemas/case-vocabulary'
import type { InterestedParty, MechanismEntry } from '../../../shared/schemas/cases'

/** Looks up a person's or an organisation's name by id. */
export interface NameBook {
  person: (id: number) => string | undefined
  organisation: (id: number) => string | undefined
}

const PEOPLE_FIELDS = new Set(['leadInvestigatorId', 'labTechnicianId', 'reviewerId'])

/** A recorded field value in words: names instead of ids, labels instead of codes. */
export function describeValue(field: string, value: unknown, names: NameBook): string {
  if (value === null || value === undefined || value === '') return NOT_GIVEN
  if (Array.isArray(value) && value.length === 0) return NOT_GIVEN
  if (PEOPLE_FIELDS.has(field)) return names.person(value as number) ?? `#${String(value)}`
  if (field === 'organisationId') return names.organisation(value as number) ?? `#${String(value)}`
  if (field === 'coInvestigatorIds') {
    return (value as number[]).map((id) => names.person(id) ?? `#${id}`).join(', ')
  }
  if (field === 'mechanisms') {
    return (value as MechanismEntry[])
      .map((m) => `${MECHANISM_LABELS[m.mechanism]}${m.primary ? ' (primary)' : ''}`)
      .join(', ')
  }
  if (field === 'interestedParties') {
    return (value as InterestedParty[]).map((party) => party.name).join(', ')
  }
  if (field === 'rootCause') return ROOT_CAUSE_LABELS[value as RootCause]
  if (field === 'turnaround') return TURNAROUND_LABELS[value as Turnaround]
  if (field === 'decisionRule') return DECISION_RULE_LABELS[value as DecisionRule]
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  return String(value)
}
