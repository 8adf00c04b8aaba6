import { TensileInputError } from './errors'
import type { EngineeringCurve, TensileRecord } from './types'

function divide(values: Float64Array, divisor: number): Float64Array {
  const result = new Float64Array(values.length)
  for (let i = 0; i < values.length; i++) result[i] = values[i]! / divisor
  return result
}

/** Engineering stress F/S0 (MPa), from force when S0 is known, else the record's stress. */
function engineeringStress(record: TensileRecord): Float64Array {
  const area = record.geometry.areaMm2
  if (record.force !== null && area !== null) return divide(record.force, area)
  if (record.stress !== null) return record.stress
  throw new TensileInputError('Neither force with a cross-section nor stress is available')
}

/** Engineering strain ΔL/Le, from extensometer extension when Le is known, else the record's strain. */
function engineeringStrain(record: TensileRecord): Float64Array {
  const le = record.geometry.extensometerGaugeLengthMm
  if (record.extension !== null && le !== null) return divide(record.extension, le)
  if (record.strain !== null) return record.strain
  throw new TensileInputError('Neither extension with a gauge length nor strain is available')
}

function rises(stress: Float64Array): boolean {
  const first = stress[0] ?? 0
  return stress.some((value) => value > first)
}

/** The engineering stress–strain curve as ISO 6892-1 defines stress and extension (terms and definitions). */
export function buildCurve(record: TensileRecord): EngineeringCurve {
  const stress = engineeringStress(record)
  if (!rises(stress)) throw new TensileInputError('The force never rises above its first value')
  return { strain: engineeringStrain(record), stress, geometry: record.geometry }
}
