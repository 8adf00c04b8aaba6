import { peakIndex } from './maximum-force'
import { fitModulusAutomatically, fitModulusInRange, type ModulusFit } from './modulus'
import { compensateToe } from './toe'
import type { EngineeringCurve, FitRange } from './types'

/** The curve after the elastic fit, with strain measured from the toe-compensated origin. */
export interface CompensatedCurve {
  strain: Float64Array
  stress: Float64Array
  modulusMPa: number
  fit: ModulusFit
  originStrain: number
}

/** ASTM E111 requires a straight fit; a low R² is worth telling the user (common practice). */
const WARN_BELOW_R_SQUARED = 0.995

/**
 * Fits the elastic line (ASTM E111) and applies toe compensation (ASTM E8/E8M) to the strain,
 * in place when the caller gives up the curve's strain (`reuse`).
 */
export function curveAfterFit(
  curve: EngineeringCurve,
  range: FitRange | undefined,
  warnings: string[],
  reuse: boolean,
): CompensatedCurve {
  const peak = peakIndex(curve.stress)
  const fit =
    range === undefined
      ? fitModulusAutomatically(curve.strain, curve.stress, peak)
      : fitModulusInRange(curve.strain, curve.stress, peak, range)
  if (fit.rounded) {
    warnings.push(
      `No sharp end to the linear part: E was fitted over the straight start of the curve, ${fit.fromMPa.toFixed(0)} to ${fit.toMPa.toFixed(0)} MPa`,
    )
  }
  if (fit.rSquared < WARN_BELOW_R_SQUARED) {
    warnings.push(`The elastic fit is not straight (R² = ${fit.rSquared.toFixed(4)})`)
  }
  const { originStrain, strain } = compensateToe(
    curve.strain,
    fit.modulusMPa,
    fit.interceptMPa,
    reuse,
  )
  return { strain, stress: curve.stress, modulusMPa: fit.modulusMPa, fit, originStrain }
}
