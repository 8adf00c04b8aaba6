import { z } from 'zod/mini'
import type { HardnessConversion } from '../hardness/convert'
import { HARDNESS_SCALES, type HardnessScale } from '../hardness/scales'
import { Id, IsoDate, optionalText } from './common'

const text = (max: number, label: string) => z._default(optionalText(max, label), null)

/** One set of hardness readings taken at one place, on one scale. */
export const HardnessCreate = z.strictObject({
  scale: z.enum(HARDNESS_SCALES, { error: 'Choose the hardness scale.' }),
  values: z
    .array(
      z
        .number({ error: 'Each reading is a number.' })
        .check(
          z.positive('Readings are above zero.'),
          z.maximum(3000, 'A reading is at most 3000.'),
        ),
      { error: 'Give the readings as a list of numbers.' },
    )
    .check(
      z.minLength(1, 'Give at least one reading.'),
      z.maxLength(50, 'At most 50 readings in one set.'),
    ),
  /** the test force, e.g. "HV10", "150 kgf", as written on the test record */
  load: text(50, 'Load'),
  location: text(191, 'Location'),
  specimenId: z._default(z.nullable(Id), null),
  sampleId: z._default(z.nullable(Id), null),
  testedOn: z._default(z.nullable(IsoDate), null),
})
export type HardnessCreate = z.output<typeof HardnessCreate>

export interface HardnessSet {
  id: number
  caseId: number
  scale: HardnessScale
  values: number[]
  load: string | null
  location: string | null
  specimenId: number | null
  sampleId: number | null
  testedOn: string | null
  /** mean of the readings, to one decimal */
  mean: number
  /** the mean on the other scales and as an approximate tensile strength (steels only) */
  conversion: HardnessConversion
  recordedBy: number
  createdAt: string
}
