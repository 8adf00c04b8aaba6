import type { Knex } from 'knex'
import type { FindingsDocument } from '../../../shared/findings/document'
import type { FindingsAuthor } from '../../../shared/schemas/findings'

export interface FindingsRow {
  caseId: number
  doc: string
  version: number
  updatedBy: number
  updatedAt: Date
  updatedByName: string | null
}

export async function findFindings(db: Knex, caseId: number, forUpdate = false) {
  const query = db('findings')
    .leftJoin('users', 'users.id', 'findings.updatedBy')
    .where('findings.caseId', caseId)
    .select('findings.*', 'users.name as updatedByName')
  if (forUpdate) query.forUpdate()
  return (await query.first()) as FindingsRow | undefined
}

export const documentOf = (row: FindingsRow) => JSON.parse(row.doc) as FindingsDocument

/** Everyone who saved the draft since the last issued revision, first author first. */
export async function findingsAuthors(db: Knex, caseId: number): Promise<FindingsAuthor[]> {
  const rows = (await db('findings_authors')
    .join('users', 'users.id', 'findings_authors.personId')
    .where('findings_authors.caseId', caseId)
    .orderBy('findings_authors.firstSavedAt')
    .orderBy('findings_authors.personId')
    .select('users.id', 'users.name', 'findings_authors.lastSavedAt')) as {
    id: number
    name: string
    lastSavedAt: Date
  }[]
  return rows.map((row) => ({ ...row, lastSavedAt: row.lastSavedAt.toISOString() }))
}

export async function recordAuthor(trx: Knex, caseId: number, personId: number): Promise<void> {
  await trx('findings_authors')
    .insert({ caseId, personId })
    .onConflict(['case_id', 'person_id'])
    .merge({ lastSavedAt: trx.fn.now(3) })
}
