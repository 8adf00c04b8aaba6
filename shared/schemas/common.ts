import { z } from 'zod/mini'
import { FIRST_YEAR, isCalendarDay, LAST_YEAR } from './dates'

// At most 15 digits: every such number is exact in a double, so the text is never rounded.
const CANONICAL_ID = /^[1-9][0-9]{0,14}$/

/**
 * A record id: a positive integer, or its canonical decimal text (as URLs and queries carry it).
 * `message` words the refusal for the field it sits in.
 */
export const idOf = (message: string) =>
  z.union(
    [
      z.int({ error: message }).check(z.positive(message)),
      z.pipe(
        z.string().check(z.regex(CANONICAL_ID, message)),
        z.transform((text) => Number(text)),
      ),
    ],
    { error: message },
  )

export const Id = idOf('Use the id of an existing record.')

export const IdParams = z.strictObject({ id: Id })
export type IdParams = z.output<typeof IdParams>

/** A real calendar date written YYYY-MM-DD, as the date input sends it. */
export const IsoDate = z
  .string({ error: 'Use a date in the form YYYY-MM-DD.' })
  .check(
    z.refine(
      isCalendarDay,
      `Use a real date in the form YYYY-MM-DD, between ${FIRST_YEAR} and ${LAST_YEAR}.`,
    ),
  )

/** A whole number in a query string, in canonical decimal form and within bounds. */
const queryInteger = (min: number, max: number, fallback: number) =>
  z._default(
    z.pipe(
      z.union([z.int(), z.string().check(z.regex(/^(0|[1-9][0-9]{0,8})$/))], {
        error: `Use a whole number from ${min} to ${max}.`,
      }),
      z.pipe(
        z.transform((value: number | string) => Number(value)),
        z.number().check(z.minimum(min), z.maximum(max)),
      ),
    ),
    fallback,
  )

export const PageQuery = {
  page: queryInteger(1, 100_000, 1),
  pageSize: queryInteger(1, 100, 25),
}

/** Required text, trimmed, at most `max` characters. */
export const trimmed = (max: number, label: string) =>
  z
    .string({ error: `${label} is required.` })
    .check(
      z.trim(),
      z.minLength(1, `${label} is required.`),
      z.maxLength(max, `${label} is at most ${max} characters.`),
    )

/** Optional text, trimmed; an empty answer is stored as null. */
export const optionalText = (max: number, label: string) =>
  z.pipe(
    z.nullable(
      z
        .string({ error: `${label} must be text.` })
        .check(z.trim(), z.maxLength(max, `${label} is at most ${max} characters.`)),
    ),
    z.transform((value: string | null) => (value === '' ? null : value)),
  )
