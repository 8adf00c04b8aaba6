import type { Knex } from 'knex'
import type { CaseFields } from '../../../shared/schemas/cases'
import type { ActivityKind, FieldChange } from '../../../shared/schemas/activity'

const PEOPLE_FIELDS = new Set<keyof CaseFields>([
  'leadInvestigatorId',
  'coInvestigatorIds',
  'labTechnicianId',
  'reviewerId',
])
const CLASSIFICATION_FIELDS = new Set<keyof CaseFields>(['mechanisms', 'rootCause'])

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b)

/** The fields whose value differs, each with its value before and after. */
export function changedFields(
  before: CaseFields,
  after: CaseFields,
): Partial<Record<keyof CaseFields, FieldChange>> {
  const changes: Partial<Record<keyof CaseFields, FieldChange>> = {}
  for (const field of Object.keys(after) as (keyof CaseFields)[]) {
    if (!same(before[field], after[field])) {
      changes[field] = { from: before[field], to: after[field] }
    }
  }
  return changes
}

/** One activity kind for one change: assignment or classification alone, else an edit. */
export function kindOfEdit(fields: (keyof CaseFields)[]): ActivityKind {
  if (fields.every((field) => PEOPLE_FIELDS.has(field))) return 'case.assigned'
  if (fields.every((field) => CLASSIFICATION_FIELDS.has(field))) return 'case.classified'
  return 'case.updated'
}

/** The columns of the `cases` row for these fields (co-investigators live in their own table). */
export function caseColumns(fields: Partial<CaseFields>): Record<string, unknown> {
  const { coInvestigatorIds: _coInvestigators, mechanisms, interestedParties, ...plain } = fields
  return {
    ...plain,
    ...(mechanisms ? { mechanisms: JSON.stringify(mechanisms) } : {}),
    ...(interestedParties ? { interestedParties: JSON.stringify(interestedParties) } : {}),
  }
}

export async function replaceCoInvestigators(
  trx: Knex,
  caseId: number,
  userIds: readonly number[],
): Promise<void> {
  await trx('case_co_investigators').where({ caseId }).delete()
  if (userIds.length === 0) return
  await trx('case_co_investigators').insert(userIds.map((userId) => ({ caseId, userId })))
}

/** The editable fields of a stored case, to merge a change into. */
export function fieldsOf(record: CaseFields): CaseFields {
  return {
    title: record.title,
    organisationId: record.organisationId,
    contactName: record.contactName,
    contactEmail: record.contactEmail,
    clientReference: record.clientReference,
    component: record.component,
    partNumber: record.partNumber,
    componentDescription: record.componentDescription,
    componentFunction: record.componentFunction,
    material: record.material,
    heatOrLot: record.heatOrLot,
    specificationId: record.specificationId,
    specificationBand: record.specificationBand,
    sectionSizeMm: record.sectionSizeMm,
    receivedOn: record.receivedOn,
    failureDate: record.failureDate,
    failureLocation: record.failureLocation,
    howFound: record.howFound,
    scope: record.scope,
    decisionRule: record.decisionRule,
    turnaround: record.turnaround,
    safetyCritical: record.safetyCritical,
    dueDate: record.dueDate,
    leadInvestigatorId: record.leadInvestigatorId,
    coInvestigatorIds: record.coInvestigatorIds,
    labTechnicianId: record.labTechnicianId,
    reviewerId: record.reviewerId,
    mechanisms: record.mechanisms,
    rootCause: record.rootCause,
    interestedParties: record.interestedParties,
  }
}
