import { fitLine } from './linear-fit'

/** Strain-hardening exponent n and strength coefficient K with the range they were fitted over. */
export interface HardeningFit {
  strainHardeningExponent: number
  strengthCoefficientMPa: number
  fit: { fromPct: number; toPct: number; points: number; rSquared: number }
}

/* ASTM E646 asks for at least five data pairs in the fitted range (recalled from memory). */
const MINIMUM_PAIRS = 5

/**
 * Default range (our rule, after ASTM E646 practice): 10 % to the strain at maximum
 * force when Ag exceeds 12 %, else from 2 % or the end of yield-point elongation, whichever is
 * later, to the strain at maximum force. Engineering strain, percent.
 */
export function defaultHardeningRange(
  agPct: number,
  strainAtMaximumPct: number,
  yieldEndPct: number | null,
) {
  const from = agPct > 12 ? 10 : Math.max(2, yieldEndPct ?? 0)
  return { from, to: strainAtMaximumPct }
}

/**
 * Hollomon σ = K εⁿ fitted by least squares of log true stress on log true strain (ASTM E646),
 * over samples up to maximum force whose engineering strain lies in the range. Null with too
 * few pairs.
 */
export function strainHardening(
  strain: Float64Array,
  stress: Float64Array,
  maximumIndex: number,
  range: { from: number; to: number },
): HardeningFit | null {
  const logStrain = new Float64Array(maximumIndex + 1)
  const logStress = new Float64Array(maximumIndex + 1)
  for (let i = 0; i <= maximumIndex; i++) {
    logStrain[i] = Math.log(Math.log1p(Math.max(strain[i]!, 1e-12)))
    logStress[i] = Math.log(Math.max(stress[i]!, 1e-12) * (1 + strain[i]!))
  }
  const inRange = (i: number) => strain[i]! * 100 >= range.from && strain[i]! * 100 <= range.to
  const line = fitLine(logStrain, logStress, 0, maximumIndex, inRange)
  if (line === null || line.points < MINIMUM_PAIRS) return null
  return {
    strainHardeningExponent: line.slope,
    strengthCoefficientMPa: Math.exp(line.intercept),
    fit: { fromPct: range.from, toPct: range.to, points: line.points, rSquared: line.rSquared },
  }
}
