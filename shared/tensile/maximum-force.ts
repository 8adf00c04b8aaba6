/** The point of maximum force and the strain assigned to it. */
export interface MaximumForcePoint {
  index: number
  stressMPa: number
  /** Total (compensated) strain at maximum force, the middle of a flat top. */
  strain: number
}

/** Index of the highest stress (the first one when several are equal). */
export function peakIndex(stress: Float64Array): number {
  let best = 0
  for (let i = 1; i < stress.length; i++) if (stress[i]! > stress[best]!) best = i
  return best
}

/**
 * Maximum force Fm (ISO 6892-1: highest force during the test after the end of yielding; for
 * Rm = Fm/S0 the stress maximum is the same point). When the top is flat — consecutive samples
 * at exactly the maximum — the strain is that of the middle of the plateau (our rule).
 */
export function maximumForce(strain: Float64Array, stress: Float64Array): MaximumForcePoint {
  const index = peakIndex(stress)
  const top = stress[index]!
  let last = index
  while (last + 1 < stress.length && stress[last + 1] === top) last++
  return { index, stressMPa: top, strain: (strain[index]! + strain[last]!) / 2 }
}
