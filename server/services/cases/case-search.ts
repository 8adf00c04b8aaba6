import type { Knex } from 'knex'
import { wordsOf } from './case-terms'

const CASE_NUMBER = /^fl-\d{0,4}(-\d{0,4})?$/i
/** InnoDB's FULLTEXT index keeps words of three characters or more (innodb_ft_min_token_size). */
const FULLTEXT_MIN = 3

export interface SearchPlan {
  /** case-number tokens: exact or prefix, on the number's unique index */
  numbers: string[]
  /** words for the FULLTEXT index, each matched as a prefix */
  words: string[]
  /** short words matched whole against the words of component and material */
  shortWords: string[]
}

/** Splits what the person typed by the search rules; no character of it reaches SQL as syntax. */
export function planSearch(text: string): SearchPlan {
  const plan: SearchPlan = { numbers: [], words: [], shortWords: [] }
  for (const token of text.trim().split(/\s+/).filter(Boolean)) {
    if (CASE_NUMBER.test(token)) {
      plan.numbers.push(token.toUpperCase())
      continue
    }
    for (const word of wordsOf(token)) {
      if (word.length >= FULLTEXT_MIN) plan.words.push(word)
      else plan.shortWords.push(word)
    }
  }
  return plan
}

/**
 * Adds the search to a query on `cases`: every token must match (AND). Words are letters and
 * digits only, so boolean-mode operators (+ - * " ( ) < > ~ @) can never come from the person.
 */
export function applySearch(query: Knex.QueryBuilder, plan: SearchPlan): void {
  const tokens = plan.numbers.length + plan.words.length + plan.shortWords.length
  // text with no letters or digits at all (say "%") names nothing, so nothing matches it
  if (tokens === 0) query.whereRaw('1 = 0')
  for (const number of plan.numbers) {
    query.where('cases.number', 'like', `${number}%`)
  }
  if (plan.words.length > 0) {
    const against = plan.words.map((word) => `+${word}*`).join(' ')
    query.whereRaw(
      'MATCH (cases.title, cases.component, cases.material, cases.client_reference) AGAINST (? IN BOOLEAN MODE)',
      [against],
    )
  }
  for (const word of plan.shortWords) {
    query.whereExists((terms) =>
      terms
        .select('case_terms.case_id')
        .from('case_terms')
        .where({ 'case_terms.kind': 'word', 'case_terms.term': word })
        .whereRaw('case_terms.case_id = cases.id'),
    )
  }
}
