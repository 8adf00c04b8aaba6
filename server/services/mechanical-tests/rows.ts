import type {
  Specimen,
  SpecimenCreate,
  TensileRecordState,
  TensileRecordView,
} from '../../../shared/schemas/mechanical-tests'
import type { SpecimenResult } from '../../../shared/tensile'

export interface SpecimenRow extends Omit<
  SpecimenCreate,
  'temperatureC' | 'testedOn' | 'machineCalibrationDue' | 'extensometerCalibrationDue'
> {
  id: number
  caseId: number
  temperatureC: number | string | null
  testedOn: string | Date | null
  machineCalibrationDue: string | Date | null
  extensometerCalibrationDue: string | Date | null
  createdAt: Date
}

export interface RecordRow {
  id: number
  caseId: number
  specimenId: number
  revision: number
  revisionOf: number | null
  superseded: number | boolean
  storageKey: string
  sha256: string
  size: number
  fileName: string
  options: string | Record<string, string>
  result: string
  state: TensileRecordState
  invalidReason: string | null
  invalidNote: string | null
  retestRecordId: number | null
  confirmedBy: number | null
  confirmedAt: Date | null
  version: number
  createdBy: number
  createdAt: Date
}

/** A DATE column as YYYY-MM-DD whichever way the driver hands it over. */
export function isoDay(value: string | Date | null): string | null {
  if (value === null) return null
  if (typeof value === 'string') return value.slice(0, 10)
  const pad = (n: number) => String(n).padStart(2, '0')
  return `${value.getFullYear()}-${pad(value.getMonth() + 1)}-${pad(value.getDate())}`
}

/** Equipment is out of calibration when its due date came before the test date. */
export function calibrationLapsed(fields: {
  testedOn: string | null
  machineCalibrationDue: string | null
  extensometerCalibrationDue: string | null
}): boolean {
  const { testedOn } = fields
  if (testedOn === null) return false
  return [fields.machineCalibrationDue, fields.extensometerCalibrationDue].some(
    (due) => due !== null && due < testedOn,
  )
}

export function toRecordView(row: RecordRow): TensileRecordView {
  return {
    id: row.id,
    specimenId: row.specimenId,
    revision: row.revision,
    revisionOf: row.revisionOf,
    fileName: row.fileName,
    sha256: row.sha256,
    size: row.size,
    options:
      typeof row.options === 'string'
        ? (JSON.parse(row.options) as Record<string, string>)
        : row.options,
    result: JSON.parse(row.result) as SpecimenResult,
    state: row.state,
    invalidReason: row.invalidReason,
    invalidNote: row.invalidNote,
    retestRecordId: row.retestRecordId,
    superseded: Boolean(row.superseded),
    confirmedBy: row.confirmedBy,
    confirmedAt: row.confirmedAt ? row.confirmedAt.toISOString() : null,
    version: row.version,
    createdAt: row.createdAt.toISOString(),
  }
}

export function toSpecimen(row: SpecimenRow, records: TensileRecordView[]): Specimen {
  const dates = {
    testedOn: isoDay(row.testedOn),
    machineCalibrationDue: isoDay(row.machineCalibrationDue),
    extensometerCalibrationDue: isoDay(row.extensometerCalibrationDue),
  }
  return {
    id: row.id,
    caseId: row.caseId,
    label: row.label,
    sampleId: row.sampleId,
    location: row.location,
    orientation: row.orientation,
    temperatureC: row.temperatureC === null ? null : Number(row.temperatureC),
    rate: row.rate,
    controlMode: row.controlMode,
    machine: row.machine,
    extensometer: row.extensometer,
    operator: row.operator,
    standard: row.standard,
    ...dates,
    calibrationLapsed: calibrationLapsed(dates),
    records,
    createdAt: row.createdAt.toISOString(),
  }
}
