import type { Knex } from 'knex'
import type { CaseRecord } from '../cases/case-record'

/**
 * Everyone who may not approve the draft: whoever saved it since the last issued revision, the
 * lead investigator and the co-investigators. Roles do not matter, only the person.
 */
export async function draftAuthorIds(db: Knex, record: CaseRecord): Promise<number[]> {
  const saved = (await db('findings_authors').where({ caseId: record.id }).select('personId')) as {
    personId: number
  }[]
  const ids = new Set<number>([...saved.map((row) => row.personId), ...record.coInvestigatorIds])
  if (record.leadInvestigatorId !== null) ids.add(record.leadInvestigatorId)
  return [...ids].sort((a, b) => a - b)
}
