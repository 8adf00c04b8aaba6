/*
 * Fracture criteria (our rule, common practice for machine records): a drop between consecutive samples of more than
 * half of Fm, or force below a tenth of Fm.
 */
const SUDDEN_DROP_FRACTION = 0.5
const RESIDUAL_FRACTION = 0.1

/**
 * The fracture point: the last sample before the force falls suddenly by more than 50 % of Fm
 * or below 10 % of Fm, searched after maximum force; the last sample when neither happens,
 * as records often stop at fracture.
 */
export function fractureIndex(stress: Float64Array, maximumIndex: number): number {
  const top = stress[maximumIndex]!
  for (let i = maximumIndex + 1; i < stress.length; i++) {
    const drop = stress[i - 1]! - stress[i]!
    if (drop > SUDDEN_DROP_FRACTION * top || stress[i]! < RESIDUAL_FRACTION * top) return i - 1
  }
  return stress.length - 1
}
