/** Modulus of resilience Rp²/(2E): elastic energy per volume up to yield; MPa = MJ/m³. */
export function modulusOfResilience(yieldMPa: number | null, modulusMPa: number): number | null {
  return yieldMPa === null ? null : (yieldMPa * yieldMPa) / (2 * modulusMPa)
}

/**
 * Toughness: area under the engineering curve from the compensated origin to fracture, by the
 * trapezoidal rule (MPa × strain = MJ/m³). The toe left of the origin is replaced by the path
 * from the origin, as toe compensation implies; later small backward steps count with their
 * sign, so noise cancels instead of piling up.
 */
export function toughness(strain: Float64Array, stress: Float64Array, fracture: number): number {
  let start = 0
  while (start <= fracture && strain[start]! < 0) start++
  let area = 0
  let previousStrain = 0
  let previousStress = 0
  for (let i = start; i <= fracture; i++) {
    area += ((stress[i]! + previousStress) / 2) * (strain[i]! - previousStrain)
    previousStrain = strain[i]!
    previousStress = stress[i]!
  }
  return area
}
