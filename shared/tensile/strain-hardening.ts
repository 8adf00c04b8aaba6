import { LineSums, type LineFit } from './linear-fit'

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
 * few pairs. Only the samples in the range are transformed, and nothing is stored per sample.
 */
export function strainHardening(
  strain: Float64Array,
  stress: Float64Array,
  maximumIndex: number,
  range: { from: number; to: number },
): HardeningFit | null {
  const line = fitLogLog(strain, stress, maximumIndex, range)
  if (line === null || line.points < MINIMUM_PAIRS) return null
  return {
    strainHardeningExponent: line.slope,
    strengthCoefficientMPa: Math.exp(line.intercept),
    fit: { fromPct: range.from, toPct: range.to, points: line.points, rSquared: line.rSquared },
  }
}

/** Least squares of ln σ_true on ln ε_true over the samples whose strain (percent) is in range. */
function fitLogLog(
  strain: Float64Array,
  stress: Float64Array,
  maximumIndex: number,
  range: { from: number; to: number },
): LineFit | null {
  const sums = new LineSums()
  for (let i = 0; i <= maximumIndex; i++) {
    const e = strain[i]!
    if (!(e * 100 >= range.from && e * 100 <= range.to)) continue
    sums.add(
      Math.log(Math.log1p(Math.max(e, 1e-12))),
      Math.log(Math.max(stress[i]!, 1e-12) * (1 + e)),
    )
  }
  return sums.line()
}
