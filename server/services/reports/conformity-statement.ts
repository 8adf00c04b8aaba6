import type { Knex } from 'knex'
import type { ConformityResult, SpecimenResult, TensileReport } from '../../../shared/tensile'

function conformitiesOf(report: TensileReport): ConformityResult[] {
  const results = Array.isArray(report)
    ? (report.filter((item) => 'modulusGPa' in item) as SpecimenResult[])
    : [report]
  return results.flatMap((result) => (result.conformity ? [result.conformity] : []))
}

/**
 * The conformity statement of the case's confirmed tensile records (ISO/IEC 17025 §7.8.6): the
 * specification and its edition, the decision rule with the uncertainty it took into account, and
 * the caution that verdicts on specimens cut from a failed part are indicative. Empty when no
 * record was judged against a specification.
 */
export async function conformityStatement(db: Knex, caseId: number): Promise<string[]> {
  const rows = (await db('tensile_records')
    .where({ caseId, state: 'confirmed', superseded: false })
    .orderBy('id')
    .select('result')) as { result: string }[]
  const lines = new Set<string>()
  for (const row of rows) {
    for (const conformity of conformitiesOf(JSON.parse(row.result) as TensileReport)) {
      const spec = conformity.specification
      const edition = spec.edition ? `edition ${spec.edition}` : 'edition not stated'
      lines.add(`Specification: ${spec.designation} ${spec.grade} (${spec.standard}, ${edition}).`)
      lines.add(`Decision rule: ${conformity.rule}.`)
      lines.add(conformity.caution)
    }
  }
  return [...lines]
}
