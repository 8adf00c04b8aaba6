import type { CurvePoint } from './preview'
import type { SpecimenResult } from './pipeline'

export type TrueCurveInput = Pick<
  SpecimenResult,
  | 'strainOriginShiftPct'
  | 'totalElongationAtMaxForcePct'
  | 'trueStressAtMaxForceMPa'
  | 'trueStrainAtMaxForce'
  | 'strainHardeningExponent'
  | 'strengthCoefficientMPa'
  | 'hardeningFit'
>

/**
 * The drawn curve as true stress σ(1 + ε) against true strain ln(1 + ε), in percent, from the
 * strain origin to maximum force: past it the neck breaks the uniform-deformation assumption
 * (ASTM E646 terms), so the true curve stops there.
 */
export function trueCurve(curve: readonly CurvePoint[], r: TrueCurveInput): CurvePoint[] {
  const origin = r.strainOriginShiftPct
  const end = r.totalElongationAtMaxForcePct + origin
  return curve
    .filter((point) => point.x >= origin && point.x <= end)
    .map((point) => {
      const strain = (point.x - origin) / 100
      return { x: Math.log1p(strain) * 100, y: point.y * (1 + strain) }
    })
}

/** σ = K·εⁿ over the true-strain window the engine fitted, for comparison with the data. */
export function hollomonLine(r: TrueCurveInput, steps = 40): CurvePoint[] {
  const { strengthCoefficientMPa: k, strainHardeningExponent: n, hardeningFit: fit } = r
  if (k === null || n === null || fit === null) return []
  const from = Math.log1p(fit.fromPct / 100)
  const to = Math.log1p(fit.toPct / 100)
  return Array.from({ length: steps + 1 }, (_, i) => {
    const strain = from + ((to - from) * i) / steps
    return { x: strain * 100, y: k * strain ** n }
  })
}
