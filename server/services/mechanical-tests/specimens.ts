import type { Knex } from 'knex'
import { isStaff } from '../../../shared/access/policy'
import type {
  Specimen,
  SpecimenCreate,
  TensileRecordView,
} from '../../../shared/schemas/mechanical-tests'
import {
  judgeAgainstLink,
  overallOf,
  type CaseOverallConformity,
} from '../../../shared/specifications/case-conformity'
import {
  summariseSpecimens,
  type SpecimenResult,
  type SpecimenSummary,
} from '../../../shared/tensile'
import { Conflict, ValidationError, NotFound } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { loadCaseMaterial } from './material-link'
import { toRecordView, toSpecimen, type RecordRow, type SpecimenRow } from './rows'

export async function findSpecimen(db: Knex, caseId: number, specimenId: number) {
  const row = (await db('specimens').where({ id: specimenId, caseId }).first()) as
    SpecimenRow | undefined
  if (!row) throw new NotFound('No such specimen in this case.')
  return row
}

/** Records that count: not invalid and not replaced by a newer revision. */
export const counts = (record: TensileRecordView) =>
  record.state !== 'invalid' && !record.superseded

export interface SpecimenList {
  specimens: Specimen[]
  /** mean, standard deviation, minimum and maximum over the valid records shown */
  summary: { specimens: number; properties: SpecimenSummary }
  /** the case's verdict against its linked record and band, over the records that count */
  conformity: CaseOverallConformity
}

/**
 * The case's specimens with their records. Staff see every record; a client sees only confirmed,
 * current results, and only the specimens that have one.
 */
export async function listSpecimens(
  { actor, db }: ServiceContext,
  caseId: number,
): Promise<SpecimenList> {
  const staff = isStaff(actor)
  const specimenRows = (await db('specimens')
    .where({ caseId })
    .orderBy('label')
    .orderBy('id')) as SpecimenRow[]
  const recordQuery = db('tensile_records').where({ caseId }).orderBy('id')
  if (!staff) recordQuery.where({ state: 'confirmed', superseded: false })
  const material = await loadCaseMaterial(db, caseId)
  const records = ((await recordQuery) as RecordRow[]).map((row) => {
    const view = toRecordView(row)
    const result = view.result as SpecimenResult
    return { ...view, caseConformity: judgeAgainstLink(result, view.options, material) }
  })
  const specimens = specimenRows
    .map((row) =>
      toSpecimen(
        row,
        records.filter((r) => r.specimenId === row.id),
      ),
    )
    .filter((specimen) => staff || specimen.records.length > 0)
  const valid = records.filter(counts).map((record) => record.result)
  const results = valid.flatMap((report) => (Array.isArray(report) ? [] : [report]))
  const judged = records.filter(counts).map((record) => record.caseConformity)
  return {
    specimens,
    summary: { specimens: results.length, properties: summariseSpecimens(results) },
    conformity: overallOf(judged, material),
  }
}

export async function createSpecimen(
  { actor, db }: ServiceContext,
  caseId: number,
  input: SpecimenCreate,
): Promise<Specimen> {
  const id = await db.transaction(async (trx) => {
    if (await trx('specimens').where({ caseId, label: input.label }).first('id'))
      throw new Conflict(`This case already has a specimen labelled ${input.label}.`)
    const sampleId = (input as { sampleId?: number | null }).sampleId
    if (sampleId && !(await trx('samples').where({ id: sampleId, caseId }).first('id'))) {
      const message = 'Choose a sample of this case.'
      throw new ValidationError(message, [{ path: 'sampleId', message }])
    }
    const [newId] = (await trx('specimens').insert({
      ...input,
      caseId,
      createdBy: actor.id,
    })) as number[]
    const details = { specimenId: newId, label: input.label }
    await recordAudit(trx, { caseId, actorId: actor.id, kind: 'specimen.added', details })
    return newId as number
  })
  return toSpecimen(await findSpecimen(db, caseId, id), [])
}
