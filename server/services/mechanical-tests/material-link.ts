import type { Knex } from 'knex'
import type { DecisionRule } from '../../../shared/schemas/case-vocabulary'
import { NOT_LINKED, type CaseMaterial } from '../../../shared/specifications/case-conformity'
import { bandAsSpecificationRecord } from '../../../shared/specifications/library-record'
import { describeBand } from '../../../shared/specifications/size-bands'
import { getSpecification } from '../specifications'

interface LinkRow {
  specificationId: number | null
  specificationBand: number | null
  sectionSizeMm: string | number | null
  decisionRule: DecisionRule
}

/** The case's linked library record and band, ready to judge its tensile records with. */
export async function loadCaseMaterial(db: Knex, caseId: number): Promise<CaseMaterial> {
  const row = (await db('cases')
    .where({ id: caseId })
    .first('specificationId', 'specificationBand', 'sectionSizeMm', 'decisionRule')) as LinkRow
  const rule = row.decisionRule
  if (row.specificationId === null || row.specificationBand === null)
    return { link: null, reason: NOT_LINKED, rule }
  const record = await getSpecification(db, row.specificationId)
  const band = record.bands[row.specificationBand]
  if (band === undefined) {
    const reason = `The linked record ${record.designation} no longer has the chosen size band: conformity not judged.`
    return { link: null, reason, rule }
  }
  const summary = {
    specificationId: record.id,
    designation: record.designation,
    standard: record.standard,
    edition: record.edition,
    grade: record.grade,
    bandIndex: row.specificationBand,
    band: describeBand(band),
    sectionSizeMm: row.sectionSizeMm === null ? null : Number(row.sectionSizeMm),
    unverified: record.unverified,
  }
  return { link: { summary, record: bandAsSpecificationRecord(record, band) }, reason: '', rule }
}
