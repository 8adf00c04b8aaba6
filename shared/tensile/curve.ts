import { TensileInputError } from './errors'
import type { EngineeringCurve, TensileRecord } from './types'

/** Divides into a new array, or into `values` itself when the caller gives them up (`reuse`). */
function divide(values: Float64Array, divisor: number, reuse: boolean): Float64Array {
  const result = reuse ? values : new Float64Array(values.length)
  for (let i = 0; i < values.length; i++) result[i] = values[i]! / divisor
  return result
}

/** Engineering stress F/S0 (MPa), from force when S0 is known, else the record's stress. */
function engineeringStress(record: TensileRecord, reuse: boolean): Float64Array {
  const area = record.geometry.areaMm2
  if (record.force !== null && area !== null) return divide(record.force, area, reuse)
  if (record.stress !== null) return record.stress
  throw new TensileInputError('Neither force with a cross-section nor stress is available')
}

/** Engineering strain ΔL/Le, from extensometer extension when Le is known, else the record's strain. */
function engineeringStrain(record: TensileRecord, reuse: boolean): Float64Array {
  const le = record.geometry.extensometerGaugeLengthMm
  if (record.extension !== null && le !== null) return divide(record.extension, le, reuse)
  if (record.strain !== null) return record.strain
  throw new TensileInputError('Neither extension with a gauge length nor strain is available')
}

function rises(stress: Float64Array): boolean {
  const first = stress[0] ?? 0
  return stress.some((value) => value > first)
}

/**
 * The engineering stress–strain curve as ISO 6892-1 defines stress and extension (terms and
 * definitions). With `reuse`, the record's own arrays are converted in place and the record
 * must not be read again: a million-point record then needs no second copy.
 */
export function buildCurve(record: TensileRecord, reuse = false): EngineeringCurve {
  const stress = engineeringStress(record, reuse)
  if (!rises(stress)) throw new TensileInputError('The force never rises above its first value')
  return { strain: engineeringStrain(record, reuse), stress, geometry: record.geometry }
}
