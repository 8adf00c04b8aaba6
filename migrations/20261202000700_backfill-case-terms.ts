import type { Knex } from 'knex'

// Fills case_terms for cases that existed before it: the words of component and material
// (lower case, letters and digits) and the failure mechanisms. A copy of the app's rule, on purpose.
const wordsOf = (text: string | null) =>
  (text ?? '')
    .toLowerCase()
    .split(/[^\p{L}\p{N}]+/u)
    .filter((word) => word.length > 0 && word.length <= 64)

export async function up(knex: Knex): Promise<void> {
  const cases = (await knex('cases').select('id', 'component', 'material', 'mechanisms')) as {
    id: number
    component: string
    material: string
    mechanisms: string | { mechanism: string }[] | null
  }[]
  for (const row of cases) {
    const mechanisms =
      typeof row.mechanisms === 'string' ? JSON.parse(row.mechanisms) : (row.mechanisms ?? [])
    const words = new Set([...wordsOf(row.component), ...wordsOf(row.material)])
    const terms = [
      ...[...words].map((term) => ({ case_id: row.id, kind: 'word', term })),
      ...(mechanisms as { mechanism: string }[]).map((entry) => ({
        case_id: row.id,
        kind: 'mechanism',
        term: entry.mechanism,
      })),
    ]
    if (terms.length > 0) await knex('case_terms').insert(terms)
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex('case_terms').delete()
}
