import type { Knex } from 'knex'

export function formatCaseNumber(year: number, sequence: number): string {
  return `FL-${year}-${String(sequence).padStart(4, '0')}`
}

/** Next number of the year, serialised by the counter row's lock until the transaction ends. */
export async function nextCaseNumber(trx: Knex, year: number): Promise<string> {
  await trx.raw(
    'INSERT INTO case_number_counters (year, last_value) VALUES (?, 1) ON DUPLICATE KEY UPDATE last_value = last_value + 1',
    [year],
  )
  const row = (await trx('case_number_counters').where({ year }).first('lastValue')) as {
    lastValue: number
  }
  return formatCaseNumber(year, row.lastValue)
}
