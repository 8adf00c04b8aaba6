import { z } from 'zod/mini'
import { idOf, trimmed } from './common'

export const HoldCreate = z.strictObject({
  /** leave out to hold the whole case */
  sampleId: z._default(z.nullable(idOf('Choose an item of this case.')), null),
  reason: trimmed(4000, 'Reason'),
})
export type HoldCreate = z.output<typeof HoldCreate>

export const HoldRelease = z.strictObject({
  reason: trimmed(4000, 'Reason'),
})

export interface LegalHold {
  id: number
  caseId: number
  sampleId: number | null
  reason: string
  placedBy: number
  placedAt: string
  releaseReason: string | null
  releasedBy: number | null
  releasedAt: string | null
}
