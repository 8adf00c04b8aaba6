/** True stress–strain pairs, defined only while deformation is uniform. */
export interface TrueCurve {
  trueStrain: Float64Array
  trueStressMPa: Float64Array
}

/**
 * True stress σ(1 + ε) and true strain ln(1 + ε) from engineering values, valid up to maximum
 * force where the volume-constant, uniform-deformation assumption holds (ASTM E646, terms).
 */
export function trueStressStrain(
  strain: Float64Array,
  stress: Float64Array,
  upTo: number,
): TrueCurve {
  const length = Math.min(upTo + 1, strain.length)
  const trueStrain = new Float64Array(length)
  const trueStressMPa = new Float64Array(length)
  for (let i = 0; i < length; i++) {
    trueStrain[i] = Math.log1p(strain[i]!)
    trueStressMPa[i] = stress[i]! * (1 + strain[i]!)
  }
  return { trueStrain, trueStressMPa }
}

/** True strain and true stress of one sample (same definitions, one point). */
export function trueValuesAt(
  strain: Float64Array,
  stress: Float64Array,
  i: number,
): { trueStrain: number; trueStressMPa: number } {
  return { trueStrain: Math.log1p(strain[i]!), trueStressMPa: stress[i]! * (1 + strain[i]!) }
}
