import type { Knex } from 'knex'
import { judgeAgainstLink } from '../../../shared/specifications/case-conformity'
import { conformityLines } from '../../../shared/specifications/conformity-lines'
import { specimenResults, type TensileReport } from '../../../shared/tensile'
import { loadCaseMaterial } from '../mechanical-tests/material-link'

/**
 * The conformity statement of the case's confirmed tensile records (ISO/IEC 17025 §7.8.6): the
 * linked specification record, its edition and size band, the decision rule with the uncertainty
 * it took into account, the caution that verdicts on specimens cut from a failed part are
 * indicative, and the unverified mark for starter limits. With no record linked it says that
 * conformity was not judged; empty when there is no confirmed record.
 */
export async function conformityStatement(db: Knex, caseId: number): Promise<string[]> {
  const rows = (await db('tensile_records')
    .where({ caseId, state: 'confirmed', superseded: false })
    .orderBy('id')
    .select('result', 'options')) as { result: string; options: string | Record<string, string> }[]
  if (rows.length === 0) return []
  const material = await loadCaseMaterial(db, caseId)
  const lines = new Set<string>()
  for (const row of rows) {
    const options = (
      typeof row.options === 'string' ? JSON.parse(row.options) : row.options
    ) as Record<string, string>
    for (const result of specimenResults(JSON.parse(row.result) as TensileReport)) {
      for (const line of conformityLines(judgeAgainstLink(result, options, material)))
        lines.add(line)
    }
  }
  return [...lines]
}
