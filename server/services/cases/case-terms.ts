import type { Knex } from 'knex'
import type { CaseFields } from '../../../shared/schemas/cases'

/** Whole words as search compares them: lower case, letters and digits only. */
export function wordsOf(text: string | null): string[] {
  return (text ?? '')
    .toLowerCase()
    .split(/[^\p{L}\p{N}]+/u)
    .filter((word) => word.length > 0 && word.length <= 64)
}

/**
 * Rewrites a case's indexed terms: the words of component and material (so short grades such as
 * "B7" are found as whole words) and its failure mechanisms (for the mechanism filter).
 */
export async function writeCaseTerms(
  trx: Knex,
  caseId: number,
  record: Pick<CaseFields, 'component' | 'material' | 'mechanisms'>,
): Promise<void> {
  await trx('case_terms').where({ caseId }).delete()
  const words = new Set([...wordsOf(record.component), ...wordsOf(record.material)])
  const terms = [
    ...[...words].map((term) => ({ caseId, kind: 'word', term })),
    ...record.mechanisms.map((entry) => ({ caseId, kind: 'mechanism', term: entry.mechanism })),
  ]
  if (terms.length > 0) await trx('case_terms').insert(terms)
}
