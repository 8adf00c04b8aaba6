import { z } from 'zod'

/** A record id; `message` words the refusal for the field it sits in. */
export const idOf = (message: string) =>
  z.coerce.number({ error: message }).int(message).positive(message)

export const Id = idOf('Use the id of an existing record.')
export type Id = z.infer<typeof Id>

export const IdParams = z.strictObject({ id: Id })
export type IdParams = z.infer<typeof IdParams>

/** A calendar date as the date input sends it (YYYY-MM-DD). */
export const IsoDate = z.iso.date({ error: 'Use a date in the form YYYY-MM-DD.' })

export const PageQuery = {
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
}

export interface Page {
  number: number
  size: number
  total: number
}

export const trimmed = (max: number, label: string) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .min(1, `${label} is required.`)
    .max(max, `${label} is at most ${max} characters.`)
