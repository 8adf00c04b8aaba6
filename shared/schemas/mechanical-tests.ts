import { z } from 'zod/mini'
import type { CaseConformity } from '../specifications/case-conformity'
import type { TensileReport } from '../tensile/pipeline'
import { Id, IsoDate, optionalText, trimmed } from './common'

const nullableDate = z._default(z.nullable(IsoDate), null)
const text = (max: number, label: string) => z._default(optionalText(max, label), null)

/** A specimen cut for testing: where it came from, and how and with what it was tested. */
export const SpecimenCreate = z.strictObject({
  label: trimmed(100, 'Label'),
  /** the evidence sample it was cut from, where the case records samples */
  sampleId: z._default(z.nullable(Id), null),
  location: text(191, 'Location'),
  orientation: text(100, 'Orientation'),
  testedOn: nullableDate,
  temperatureC: z._default(
    z.nullable(
      z
        .number({ error: 'Temperature must be a number.' })
        .check(
          z.minimum(-273.15, 'No temperature is below absolute zero.'),
          z.maximum(2000, 'Temperature is at most 2000 °C.'),
        ),
    ),
    null,
  ),
  rate: text(100, 'Rate'),
  controlMode: text(100, 'Control mode'),
  machine: text(191, 'Machine'),
  machineCalibrationDue: nullableDate,
  extensometer: text(191, 'Extensometer'),
  extensometerCalibrationDue: nullableDate,
  operator: text(191, 'Operator'),
  standard: text(100, 'Standard'),
})
export type SpecimenCreate = z.output<typeof SpecimenCreate>

export interface Specimen extends SpecimenCreate {
  id: number
  caseId: number
  /** the machine or the extensometer was past its calibration due date on the test date */
  calibrationLapsed: boolean
  records: TensileRecordView[]
  createdAt: string
}

export const TENSILE_RECORD_STATES = ['draft', 'confirmed', 'invalid'] as const
export type TensileRecordState = (typeof TENSILE_RECORD_STATES)[number]

export const INVALID_REASONS = [
  'fracture_outside_gauge',
  'slipped_grips',
  'extensometer_slipped',
  'specimen_damaged',
  'other',
] as const
export const INVALID_REASON_LABELS: Record<(typeof INVALID_REASONS)[number], string> = {
  fracture_outside_gauge: 'Fracture outside the gauge marks',
  slipped_grips: 'Slipped grips',
  extensometer_slipped: 'Extensometer slipped',
  specimen_damaged: 'Specimen damaged before the test',
  other: 'Other',
}

export const TensileRecordInvalidate = z.strictObject({
  reason: z.enum(INVALID_REASONS, { error: 'Choose why the record is invalid.' }),
  note: text(1000, 'Note'),
  /** the record of the retest that replaces this one */
  retestRecordId: z._default(z.nullable(Id), null),
  version: z.int({ error: 'Send the version of the record.' }).check(z.positive()),
})
export type TensileRecordInvalidate = z.output<typeof TensileRecordInvalidate>

export const TensileRecordVersion = z.strictObject({
  version: z.int({ error: 'Send the version of the record.' }).check(z.positive()),
})

/**
 * Recomputation with other options (the elastic fit range, the offsets …); the options are the
 * engine's options contract, checked by the engine itself.
 */
export const TensileRecordRecompute = z.strictObject({
  options: z.record(z.string(), z.unknown()),
  version: z.int({ error: 'Send the version of the record.' }).check(z.positive()),
})
export type TensileRecordRecompute = z.output<typeof TensileRecordRecompute>

export interface TensileRecordView {
  id: number
  specimenId: number
  /** 1 for the first upload; each change to a confirmed record is a new revision */
  revision: number
  /** the record this revision replaces, when it is one */
  revisionOf: number | null
  fileName: string
  sha256: string
  size: number
  options: Record<string, string>
  /** exactly the engine's (the command line's --json) answer for the file and options */
  result: TensileReport
  /**
   * The result judged against the case's linked library record and size band, beside the
   * engine's answer (in the case's list of specimens)
   */
  caseConformity?: CaseConformity
  state: TensileRecordState
  invalidReason: string | null
  invalidNote: string | null
  retestRecordId: number | null
  /** a newer revision replaced this one */
  superseded: boolean
  confirmedBy: number | null
  confirmedAt: string | null
  version: number
  createdAt: string
}

/** A million-point export is about 70 MB; the engine itself reads up to 256 M characters. */
export const MAX_TENSILE_RECORD_BYTES = 128 * 1024 * 1024
