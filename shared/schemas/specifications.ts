import { z } from 'zod/mini'
import { optionalText, trimmed } from './common'

/** Which yield a specification states its minimum for, as the standards name them. */
export const SPEC_YIELD_KINDS = ['Rp0.2', 'ReH', 'ReL', 'Rt0.5'] as const

const stress = (label: string) =>
  z.nullable(
    z
      .number({ error: `${label} must be a number.` })
      .check(
        z.positive(`${label} must be above zero.`),
        z.maximum(5000, `${label} is at most 5000.`),
      ),
  )

const percent = (label: string) =>
  z.nullable(
    z
      .number({ error: `${label} must be a number.` })
      .check(
        z.minimum(0, `${label} cannot be negative.`),
        z.maximum(100, `${label} is at most 100.`),
      ),
  )

const size = (label: string) =>
  z.nullable(
    z
      .number({ error: `${label} must be a number.` })
      .check(z.minimum(0, `${label} cannot be negative.`), z.maximum(10_000)),
  )

const GaugeBasis = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('fixed'), lengthMm: z.number().check(z.positive()) }),
    z.strictObject({ kind: z.literal('proportional'), k: z.number().check(z.positive()) }),
    z.strictObject({ kind: z.literal('diameters'), multiple: z.number().check(z.positive()) }),
  ],
  { error: 'Give the gauge-length basis: fixed length, k·√S0 or a multiple of the diameter.' },
)

/**
 * The limits for one range of section size: a record for bars up to 16 mm does not judge a
 * 60 mm shaft. Values in the units the standard publishes them in (`units` of the record).
 */
export const SpecificationBand = z.strictObject({
  overMm: size('The lower size bound'),
  upToMm: size('The upper size bound'),
  yield: z.nullable(
    z.strictObject({
      min: z.number({ error: 'Give the minimum yield.' }).check(z.positive()),
      kind: z.enum(SPEC_YIELD_KINDS, { error: 'Choose which yield the minimum is for.' }),
    }),
  ),
  tensileStrength: z.strictObject({ min: stress('Minimum Rm'), max: stress('Maximum Rm') }),
  elongation: z.array(
    z.strictObject({ minPct: z.number().check(z.positive()), basis: GaugeBasis }),
  ),
  reductionOfAreaMinPct: percent('Minimum reduction of area'),
  hardness: z.nullable(
    z.strictObject({
      min: z.nullable(z.number().check(z.positive())),
      max: z.nullable(z.number().check(z.positive())),
      scale: trimmed(20, 'Hardness scale'),
    }),
  ),
})
export type SpecificationBand = z.output<typeof SpecificationBand>

const fields = {
  designation: trimmed(100, 'Designation'),
  standard: trimmed(100, 'Standard'),
  edition: optionalText(50, 'Edition'),
  grade: trimmed(191, 'Grade'),
  productForm: trimmed(100, 'Product form'),
  units: z.enum(['MPa', 'ksi'], { error: 'Give the units the standard publishes: MPa or ksi.' }),
  bands: z
    .array(SpecificationBand)
    .check(
      z.minLength(1, 'Give at least one section-size band.'),
      z.maxLength(20, 'At most 20 size bands.'),
    ),
  source: trimmed(500, 'Source'),
}

export const SpecificationCreate = z.strictObject(fields)
export type SpecificationCreate = z.output<typeof SpecificationCreate>

export const SpecificationUpdate = z.strictObject({
  ...z.partial(z.strictObject(fields)).shape,
  /** an administrator has checked every limit against this edition of the standard */
  checkedAgainstEdition: z.optional(trimmed(50, 'Edition checked')),
  version: z.int({ error: 'Send the version of the record you edited.' }).check(z.positive()),
})
export type SpecificationUpdate = z.output<typeof SpecificationUpdate>

export interface Specification extends SpecificationCreate {
  id: number
  /** starter limits nobody has checked against the edition yet */
  unverified: boolean
  checkedAgainstEdition: string | null
  checkedBy: number | null
  checkedAt: string | null
  version: number
}

export const UNVERIFIED_MARK = 'Unverified starter limits: check them against the edition.'
