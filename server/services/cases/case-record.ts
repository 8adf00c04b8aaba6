import type { Knex } from 'knex'
import type { CaseRef } from '../../../shared/access/policy'
import type {
  CaseDetail,
  CaseFields,
  CaseSummary,
  ClientCaseView,
  InterestedParty,
  MechanismEntry,
  PersonRef,
} from '../../../shared/schemas/cases'
import type { SpecificationBand } from '../../../shared/schemas/specifications'
import { describeBand } from '../../../shared/specifications/size-bands'
import { clientStageOf, type CaseState } from '../../../shared/workflow/case-states'
import { NotFound } from '../../errors'

/** A case as stored, with its co-investigators: what the loader hands to every case route. */
export type CaseRecord = CaseFields &
  CaseRef & {
    id: number
    number: string
    status: CaseState
    organisationName: string
    version: number
    createdAt: string
    updatedAt: string
  }

type CaseRow = Omit<
  CaseRecord,
  | 'createdAt'
  | 'updatedAt'
  | 'coInvestigatorIds'
  | 'mechanisms'
  | 'interestedParties'
  | 'sectionSizeMm'
> & {
  sectionSizeMm: string | number | null
  createdAt: Date
  updatedAt: Date
  safetyCritical: number | boolean
  mechanisms: string | MechanismEntry[] | null
  interestedParties: string | InterestedParty[] | null
}

// MariaDB's JSON is text with a check: mysql2 hands it back as a string.
function jsonArray<T>(value: string | T[] | null): T[] {
  if (value === null) return []
  return typeof value === 'string' ? (JSON.parse(value) as T[]) : value
}

function toRecord(row: CaseRow, coInvestigatorIds: number[]): CaseRecord {
  return {
    ...row,
    safetyCritical: Boolean(row.safetyCritical),
    // DECIMAL comes back from mysql2 as text
    sectionSizeMm: row.sectionSizeMm === null ? null : Number(row.sectionSizeMm),
    mechanisms: jsonArray(row.mechanisms),
    interestedParties: jsonArray(row.interestedParties),
    coInvestigatorIds,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}

/** The case with this id within the organisation scope; out of scope answers like missing. */
export async function findCase(
  db: Knex,
  id: number,
  organisationScope?: number,
  options: { forUpdate?: boolean } = {},
): Promise<CaseRecord> {
  // one statement: every case route loads its case through here
  const query = db('cases')
    .join('organisations', 'organisations.id', 'cases.organisationId')
    .select(
      'cases.*',
      'organisations.name as organisationName',
      db.raw(
        '(SELECT GROUP_CONCAT(user_id ORDER BY user_id) FROM case_co_investigators WHERE case_co_investigators.case_id = cases.id) AS co_investigator_list',
      ),
    )
    .where('cases.id', id)
  if (organisationScope !== undefined) query.where('cases.organisationId', organisationScope)
  if (options.forUpdate) query.forUpdate()
  const found = (await query.first()) as
    (CaseRow & { coInvestigatorList: string | null }) | undefined
  if (!found) throw new NotFound('No such case.')
  const { coInvestigatorList, ...row } = found
  return toRecord(row, coInvestigatorList ? coInvestigatorList.split(',').map(Number) : [])
}

/** The linked library record and band in words, for display. */
async function linkedSpecificationOf(db: Knex, record: CaseRecord): Promise<string | null> {
  if (record.specificationId === null || record.specificationBand === null) return null
  const row = (await db('specifications')
    .where({ id: record.specificationId })
    .first('designation', 'standard', 'bands', 'unverified')) as
    | {
        designation: string
        standard: string
        bands: string | SpecificationBand[]
        unverified: number
      }
    | undefined
  if (!row) return null
  const bands =
    typeof row.bands === 'string' ? (JSON.parse(row.bands) as SpecificationBand[]) : row.bands
  const band = bands[record.specificationBand]
  const size = band ? describeBand(band) : 'a band the record no longer has'
  const mark = row.unverified ? ' — unverified starter limits' : ''
  return `${row.designation} (${row.standard}), ${size}${mark}`
}

/** Names of everyone on the case, for display. */
async function peopleOn(db: Knex, record: CaseRecord): Promise<PersonRef[]> {
  const ids = [
    record.leadInvestigatorId,
    ...record.coInvestigatorIds,
    record.labTechnicianId,
    record.reviewerId,
  ].filter((id): id is number => id !== null)
  if (ids.length === 0) return []
  return (await db('users').whereIn('id', ids).select('id', 'name')) as PersonRef[]
}

export async function toDetail(
  db: Knex,
  record: CaseRecord,
  allowedNextStates: CaseState[],
): Promise<CaseDetail> {
  const people = await peopleOn(db, record)
  const leadInvestigatorName =
    people.find((person) => person.id === record.leadInvestigatorId)?.name ?? null
  const linkedSpecification = await linkedSpecificationOf(db, record)
  return { ...record, people, leadInvestigatorName, linkedSpecification, allowedNextStates }
}

/** The client's plain status line: an explicit list of fields, never a copy of the row. */
export function toClientView(record: {
  id: number
  number: string
  title: string
  component: string
  clientReference: string | null
  status: CaseState
}): ClientCaseView {
  return {
    id: record.id,
    number: record.number,
    title: record.title,
    component: record.component,
    clientReference: record.clientReference,
    stage: clientStageOf(record.status),
  }
}

export function toSummary(
  row: Omit<CaseSummary, 'createdAt' | 'updatedAt' | 'safetyCritical'> & {
    createdAt: Date
    updatedAt: Date
    safetyCritical: number | boolean
  },
): CaseSummary {
  return {
    id: row.id,
    number: row.number,
    title: row.title,
    status: row.status,
    turnaround: row.turnaround,
    safetyCritical: Boolean(row.safetyCritical),
    organisationId: row.organisationId,
    organisationName: row.organisationName,
    component: row.component,
    material: row.material,
    leadInvestigatorId: row.leadInvestigatorId,
    leadInvestigatorName: row.leadInvestigatorName,
    dueDate: row.dueDate,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}
