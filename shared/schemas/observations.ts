import { z } from 'zod/mini'
import { idOf, trimmed } from './common'

const ids = (message: string) =>
  z._default(
    z.array(idOf(message)).check(z.maxLength(100, 'At most 100 links per observation.')),
    [],
  )

export const ObservationCreate = z.strictObject({
  text: trimmed(8000, 'What was seen or measured'),
  photoIds: ids('Choose photos of this case.'),
  sampleIds: ids('Choose items of this case.'),
})
export type ObservationCreate = z.output<typeof ObservationCreate>

export const WithdrawalCreate = z.strictObject({
  reason: trimmed(4000, 'Reason'),
})

export interface Observation {
  id: number
  caseId: number
  /** the number the findings cite, `O-<n>` */
  number: string
  text: string
  photoIds: number[]
  sampleIds: number[]
  recordedBy: number
  recordedByName: string | null
  createdAt: string
  withdrawn: boolean
  withdrawReason: string | null
  withdrawnAt: string | null
}

export const observationNumber = (n: number) => `O-${n}`
