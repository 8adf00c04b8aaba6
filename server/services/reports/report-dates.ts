import type { Knex } from 'knex'
import { isoDay } from '../mechanical-tests/rows'

type Day = string | Date | null

/**
 * The dates a report states (ISO/IEC 17025 §7.8.2.1): when the items came in (the first sample
 * received, else the case's own date of receipt), and the span of examinations and tests (from
 * the first photograph taken in or specimen tested to the last).
 */
export async function reportDates(db: Knex, caseId: number, caseReceivedOn: Day) {
  const samples = (await db('samples').where({ caseId }).min({ first: 'receivedOn' }).first()) as
    { first: Day } | undefined
  const specimens = (await db('specimens')
    .where({ caseId })
    .min({ first: 'testedOn' })
    .max({ last: 'testedOn' })
    .first()) as { first: Day; last: Day } | undefined
  const photos = (await db('photos')
    .where({ caseId })
    .min({ first: 'createdAt' })
    .max({ last: 'createdAt' })
    .first()) as { first: Day; last: Day } | undefined
  const days = [specimens?.first, specimens?.last, photos?.first, photos?.last]
    .map((day) => isoDay(day ?? null))
    .filter((day): day is string => day !== null)
    .sort()
  return {
    itemsReceived: isoDay(samples?.first ?? null) ?? isoDay(caseReceivedOn),
    testsFrom: days[0] ?? null,
    testsTo: days[days.length - 1] ?? null,
  }
}
