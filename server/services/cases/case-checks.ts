import type { Knex } from 'knex'
import type { FieldIssue } from '../../../shared/api/errors'
import { caseDateIssues, type CaseFields } from '../../../shared/schemas/cases'
import { todayIso } from '../../../shared/schemas/dates'
import type { Role } from '../../../shared/schemas/roles'
import { AppError, ValidationError } from '../../errors'
import { LINK_FIELDS, materialLinkIssues } from './material-link-checks'

type Assignments = Pick<
  CaseFields,
  'leadInvestigatorId' | 'coInvestigatorIds' | 'labTechnicianId' | 'reviewerId'
>

const SLOTS: { field: keyof Assignments; role: Role; message: string }[] = [
  { field: 'leadInvestigatorId', role: 'investigator', message: 'Choose an active investigator.' },
  {
    field: 'coInvestigatorIds',
    role: 'investigator',
    message: 'Choose active investigators as co-investigators.',
  },
  { field: 'labTechnicianId', role: 'lab', message: 'Choose an active lab technician.' },
  { field: 'reviewerId', role: 'reviewer', message: 'Choose an active reviewer.' },
]

async function activeHolders(db: Knex, ids: number[]): Promise<Map<number, Role[]>> {
  const rows = (await db('users')
    .join('user_roles', 'user_roles.userId', 'users.id')
    .whereIn('users.id', ids)
    .where('users.active', true)
    .select('users.id', 'user_roles.role')) as { id: number; role: Role }[]
  const byId = new Map<number, Role[]>()
  for (const { id, role } of rows) byId.set(id, [...(byId.get(id) ?? []), role])
  return byId
}

/** Everyone assigned holds the role the part needs and is active. */
async function assignmentIssues(db: Knex, people: Assignments): Promise<FieldIssue[]> {
  const idsOf = (field: keyof Assignments): number[] => {
    const value = people[field]
    return Array.isArray(value) ? value : value === null ? [] : [value]
  }
  const holders = await activeHolders(
    db,
    SLOTS.flatMap(({ field }) => idsOf(field)),
  )
  return SLOTS.filter(({ field, role }) =>
    idsOf(field).some((id) => !holders.get(id)?.includes(role)),
  ).map(({ field, message }) => ({ path: field, message }))
}

/** The reviewer is never the lead investigator or one of the co-investigators. */
function checkReviewerIndependent(people: Assignments): void {
  const { reviewerId, leadInvestigatorId, coInvestigatorIds } = people
  if (reviewerId === null) return
  if (reviewerId === leadInvestigatorId || coInvestigatorIds.includes(reviewerId)) {
    throw new AppError(
      'reviewer_is_lead',
      'The reviewer cannot be the lead investigator or a co-investigator of the same case.',
      [{ path: 'reviewerId', message: 'Choose a reviewer who does not work on this case.' }],
    )
  }
  if (leadInvestigatorId !== null && coInvestigatorIds.includes(leadInvestigatorId)) {
    throw new ValidationError('The lead investigator is not also a co-investigator.', [
      { path: 'coInvestigatorIds', message: 'The lead investigator is already on the case.' },
    ])
  }
}

async function organisationIssues(db: Knex, organisationId: number): Promise<FieldIssue[]> {
  const organisation = await db('organisations').where({ id: organisationId }).first('active')
  return organisation?.active
    ? []
    : [{ path: 'organisationId', message: 'Choose an active client organisation.' }]
}

/**
 * The rules between fields and against other records, on the case as it would be after the
 * change: `changed` names the fields to check against other records (unchanged ones stay valid
 * even if, say, a person was deactivated since).
 */
export async function checkCaseRecord(
  db: Knex,
  record: CaseFields,
  changed: ReadonlySet<keyof CaseFields>,
  now: Date,
): Promise<void> {
  checkReviewerIndependent(record)
  const issues = caseDateIssues(record, todayIso(now))
  if (changed.has('organisationId')) {
    issues.push(...(await organisationIssues(db, record.organisationId)))
  }
  const people = Object.fromEntries(
    SLOTS.map(({ field }) => [field, changed.has(field) ? record[field] : null]),
  ) as unknown as Assignments
  people.coInvestigatorIds = changed.has('coInvestigatorIds') ? record.coInvestigatorIds : []
  issues.push(...(await assignmentIssues(db, people)))
  if (LINK_FIELDS.some((field) => changed.has(field)))
    issues.push(...(await materialLinkIssues(db, record)))
  if (issues.length > 0) {
    const [first] = issues
    throw new ValidationError(first?.message ?? 'The case record is not valid.', issues)
  }
}
