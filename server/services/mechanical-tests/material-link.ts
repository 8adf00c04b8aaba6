import type { Knex } from 'knex'
import type { DecisionRule } from '../../../shared/schemas/case-vocabulary'
import type { CaseMaterial } from '../../../shared/specifications/case-conformity'
import { caseMaterialOf } from '../../../shared/specifications/case-material'
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
  const record =
    row.specificationId === null ? null : await getSpecification(db, row.specificationId)
  const sectionSizeMm = row.sectionSizeMm === null ? null : Number(row.sectionSizeMm)
  return caseMaterialOf(record, { ...row, sectionSizeMm })
}
