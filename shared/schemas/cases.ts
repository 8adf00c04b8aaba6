import { z } from 'zod/mini'
import type { FieldIssue } from '../api/errors'
import {
  CASE_STATES,
  CLIENT_STAGES,
  type CaseState,
  type ClientStage,
} from '../workflow/case-states'
import { Email } from './auth'
import {
  DECISION_RULES,
  MECHANISMS,
  PARTY_ROLES,
  ROOT_CAUSES,
  TURNAROUNDS,
  type DecisionRule,
  type Mechanism,
  type PartyRole,
  type RootCause,
  type Turnaround,
} from './case-vocabulary'
import { Id, idOf, IsoDate, optionalText, PageQuery, trimmed } from './common'

export const CaseStatus = z.enum(CASE_STATES)
export const CASE_NUMBER_PATTERN = /^FL-\d{4}-\d{4}$/

const distinct = <T>(key: (item: T) => unknown, message: string) =>
  z.refine<T[]>((items) => new Set(items.map(key)).size === items.length, message)

export const MechanismEntry = z.strictObject({
  mechanism: z.enum(MECHANISMS, { error: 'Choose a mechanism from the list.' }),
  primary: z.boolean(),
})
export type MechanismEntry = z.output<typeof MechanismEntry>

export const InterestedParty = z.strictObject({
  name: trimmed(191, 'Name'),
  organisation: optionalText(191, 'Organisation'),
  email: z.nullable(Email),
  role: z.enum(PARTY_ROLES, { error: 'Choose the party’s role.' }),
})
export type InterestedParty = z.output<typeof InterestedParty>

const personId = (what: string) => z.nullable(idOf(`Choose the ${what} from the list.`))

/** Every field of the case record a person can set; none has a default here. */
const caseFields = {
  title: trimmed(191, 'Title'),
  organisationId: idOf('Choose the client organisation.'),
  contactName: optionalText(191, 'Contact name'),
  contactEmail: z.nullable(Email),
  clientReference: optionalText(100, 'Client reference'),
  component: trimmed(191, 'Component'),
  partNumber: optionalText(100, 'Part number'),
  componentDescription: optionalText(4000, 'Description'),
  componentFunction: optionalText(1000, 'Function in service'),
  material: trimmed(191, 'Material as specified'),
  heatOrLot: optionalText(100, 'Heat or lot'),
  /** the library record the material is judged against, with one of its size bands */
  specificationId: z.nullable(idOf('Choose a specification record from the library.')),
  specificationBand: z.nullable(
    z
      .int({ error: 'Choose a size band of the record.' })
      .check(z.minimum(0, 'Choose a size band of the record.'), z.maximum(19)),
  ),
  /** the part's governing section size in mm (diameter or thickness), which picks the band */
  sectionSizeMm: z.nullable(
    z
      .number({ error: 'The section size must be a number of millimetres.' })
      .check(
        z.positive('The section size must be above zero.'),
        z.maximum(10_000, 'The section size is at most 10000 mm.'),
      ),
  ),
  receivedOn: z.nullable(IsoDate),
  failureDate: z.nullable(IsoDate),
  failureLocation: optionalText(191, 'Failure location'),
  howFound: optionalText(4000, 'How the failure was found'),
  scope: optionalText(4000, 'Scope of work'),
  decisionRule: z.enum(DECISION_RULES, { error: 'Choose a decision rule.' }),
  turnaround: z.enum(TURNAROUNDS, { error: 'Choose a turnaround.' }),
  safetyCritical: z.boolean({ error: 'Say whether the failure is safety-critical.' }),
  dueDate: z.nullable(IsoDate),
  leadInvestigatorId: personId('lead investigator'),
  coInvestigatorIds: z.array(idOf('Choose co-investigators from the list.')).check(
    z.maxLength(10, 'At most 10 co-investigators.'),
    distinct<number>((id) => id, 'Name each co-investigator only once.'),
  ),
  labTechnicianId: personId('lab technician'),
  reviewerId: personId('reviewer'),
  mechanisms: z.array(MechanismEntry).check(
    z.maxLength(10, 'At most 10 mechanisms.'),
    distinct<MechanismEntry>((entry) => entry.mechanism, 'Name each mechanism only once.'),
    z.refine(
      (entries) => entries.length === 0 || entries.filter((e) => e.primary).length === 1,
      'Mark exactly one mechanism as the primary one.',
    ),
  ),
  rootCause: z.nullable(z.enum(ROOT_CAUSES, { error: 'Choose a root cause from the list.' })),
  interestedParties: z.array(InterestedParty).check(z.maxLength(20, 'At most 20 parties.')),
}

export const CaseCreate = z.strictObject({
  title: caseFields.title,
  organisationId: caseFields.organisationId,
  component: caseFields.component,
  material: caseFields.material,
  contactName: z._default(caseFields.contactName, null),
  contactEmail: z._default(caseFields.contactEmail, null),
  clientReference: z._default(caseFields.clientReference, null),
  partNumber: z._default(caseFields.partNumber, null),
  componentDescription: z._default(caseFields.componentDescription, null),
  componentFunction: z._default(caseFields.componentFunction, null),
  heatOrLot: z._default(caseFields.heatOrLot, null),
  specificationId: z._default(caseFields.specificationId, null),
  specificationBand: z._default(caseFields.specificationBand, null),
  sectionSizeMm: z._default(caseFields.sectionSizeMm, null),
  receivedOn: z._default(caseFields.receivedOn, null),
  failureDate: z._default(caseFields.failureDate, null),
  failureLocation: z._default(caseFields.failureLocation, null),
  howFound: z._default(caseFields.howFound, null),
  scope: z._default(caseFields.scope, null),
  decisionRule: z._default(caseFields.decisionRule, 'simple'),
  turnaround: z._default(caseFields.turnaround, 'standard'),
  safetyCritical: z._default(caseFields.safetyCritical, false),
  dueDate: z._default(caseFields.dueDate, null),
  leadInvestigatorId: z._default(caseFields.leadInvestigatorId, null),
  coInvestigatorIds: z._default(caseFields.coInvestigatorIds, []),
  labTechnicianId: z._default(caseFields.labTechnicianId, null),
  reviewerId: z._default(caseFields.reviewerId, null),
  mechanisms: z._default(caseFields.mechanisms, []),
  rootCause: z._default(caseFields.rootCause, null),
  interestedParties: z._default(caseFields.interestedParties, []),
})
export type CaseCreate = z.output<typeof CaseCreate>
export type CaseFields = CaseCreate
export type CaseFieldName = keyof CaseFields

/** A change to the case: any subset of its fields, plus the version the editor saw. */
export const CaseUpdate = z.strictObject({
  ...z.partial(z.strictObject(caseFields)).shape,
  version: z.int({ error: 'Send the version of the case you edited.' }).check(z.positive()),
})
export type CaseUpdate = z.output<typeof CaseUpdate>

export const CaseStatusChange = z.strictObject({
  status: z.enum(CASE_STATES, { error: 'Choose a status from the list.' }),
})
export type CaseStatusChange = z.output<typeof CaseStatusChange>

export const CASE_SORTS = [
  'number',
  'title',
  'component',
  'status',
  'turnaround',
  'dueDate',
  'createdAt',
  'updatedAt',
] as const
export type CaseSort = (typeof CASE_SORTS)[number]

/** A yes/no filter in a query string: only `true` switches it on. */
const queryFlag = z.optional(
  z.pipe(
    z.enum(['true', 'false'], { error: 'Use true or false.' }),
    z.transform((value) => value === 'true'),
  ),
)

export const CaseListQuery = z.strictObject({
  ...PageQuery,
  status: z.optional(CaseStatus),
  stage: z.optional(z.enum(CLIENT_STAGES)),
  organisationId: z.optional(Id),
  /** lead investigator or co-investigator */
  investigatorId: z.optional(Id),
  overdue: queryFlag,
  safetyCritical: queryFlag,
  /** the beginning of the material as specified, e.g. "42CrMo4" */
  material: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(100))),
  mechanism: z.optional(z.enum(MECHANISMS, { error: 'Choose a mechanism from the list.' })),
  q: z.optional(z.string().check(z.trim(), z.maxLength(100))),
  sort: z._default(
    z.enum(CASE_SORTS, { error: 'Sort by one of the listed columns.' }),
    'createdAt',
  ),
  order: z._default(z.enum(['asc', 'desc'], { error: 'Use asc or desc.' }), 'desc'),
})
export type CaseListQuery = z.output<typeof CaseListQuery>

/**
 * The date rules of a case: the failure is not in the future and not after the part was received;
 * the due date is not before the part was received (nor before the failure).
 */
export function caseDateIssues(
  dates: Pick<CaseFields, 'receivedOn' | 'failureDate' | 'dueDate'>,
  today: string,
): FieldIssue[] {
  const issues: FieldIssue[] = []
  const { receivedOn, failureDate, dueDate } = dates
  if (failureDate && failureDate > today) {
    issues.push({ path: 'failureDate', message: 'The failure date cannot be in the future.' })
  } else if (failureDate && receivedOn && failureDate > receivedOn) {
    issues.push({
      path: 'failureDate',
      message: 'The failure date cannot be after the date the part was received.',
    })
  }
  if (receivedOn && receivedOn > today) {
    issues.push({ path: 'receivedOn', message: 'The date received cannot be in the future.' })
  }
  const earliestDue = receivedOn ?? failureDate
  if (dueDate && earliestDue && dueDate < earliestDue) {
    issues.push({
      path: 'dueDate',
      message: receivedOn
        ? 'The due date cannot be before the date the part was received.'
        : 'The due date cannot be before the failure date.',
    })
  }
  return issues
}

export interface PersonRef {
  id: number
  name: string
}

/** One row of the staff's case list. */
export interface CaseSummary {
  id: number
  number: string
  title: string
  status: CaseState
  turnaround: Turnaround
  safetyCritical: boolean
  organisationId: number
  organisationName: string
  component: string
  material: string
  leadInvestigatorId: number | null
  leadInvestigatorName: string | null
  dueDate: string | null
  createdAt: string
  updatedAt: string
}

/** The whole case record as staff see it. */
export interface CaseDetail extends CaseSummary {
  contactName: string | null
  contactEmail: string | null
  clientReference: string | null
  partNumber: string | null
  componentDescription: string | null
  componentFunction: string | null
  heatOrLot: string | null
  /** the library record and size band the material is judged against */
  specificationId: number | null
  specificationBand: number | null
  sectionSizeMm: number | null
  /** the linked record and band in words, with the unverified mark when it applies */
  linkedSpecification: string | null
  receivedOn: string | null
  failureDate: string | null
  failureLocation: string | null
  howFound: string | null
  scope: string | null
  decisionRule: DecisionRule
  coInvestigatorIds: number[]
  labTechnicianId: number | null
  reviewerId: number | null
  /** names of everyone on the case, for display */
  people: PersonRef[]
  mechanisms: MechanismEntry[]
  rootCause: RootCause | null
  interestedParties: InterestedParty[]
  version: number
  /** the plain status changes the asking person may make now */
  allowedNextStates: CaseState[]
}

/** What a client sees of a case: a plain status line, never internal fields. */
export interface ClientCaseView {
  id: number
  number: string
  title: string
  component: string
  clientReference: string | null
  stage: ClientStage
}

export type { Mechanism, PartyRole, RootCause, Turnaround, DecisionRule }
