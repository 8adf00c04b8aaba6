import { fitLine } from './linear-fit'
import { plasticStrainAt } from './toe'

/** Upper and lower yield strength and yield-point elongation of a discontinuous yield. */
export interface DiscontinuousYield {
  upperYieldMPa: number
  lowerYieldMPa: number
  yieldPointElongationPct: number
  /** Strain (fraction) where uniform hardening starts: the end of the yield-point elongation. */
  endStrain: number
}

/* The detection rule: a drop of at least 0.5 % of the force after a local maximum
 * in the early plastic range. Early plastic range (our reading, common practice): plastic
 * strain below 0.5 %, a new highest force so far, and above half the maximum force, so that
 * scatter at the foot of the curve, where 0.5 % is a tiny force, cannot trigger it. */
const DROP_FRACTION = 0.005
const EARLY_PLASTIC_STRAIN = 0.005
const LOWEST_FRACTION_OF_MAXIMUM = 0.5
const TANGENT_POINTS = 5

function isLocalMaximum(stress: Float64Array, i: number): boolean {
  return stress[i]! >= stress[i - 1]! && stress[i]! > stress[i + 1]!
}

function isLocalMinimum(stress: Float64Array, i: number): boolean {
  return stress[i]! < stress[i - 1]! && stress[i]! <= stress[i + 1]!
}

/** True when the stress falls by the drop fraction after `peak` before rising above it again. */
function dropsAfter(stress: Float64Array, peak: number, end: number): boolean {
  const floor = stress[peak]! * (1 - DROP_FRACTION)
  for (let i = peak + 1; i <= end && stress[i]! <= stress[peak]!; i++)
    if (stress[i]! <= floor) return true
  return false
}

/** Index of the upper yield point, or -1 when yielding is continuous. */
function upperYieldIndex(
  strain: Float64Array,
  stress: Float64Array,
  modulusMPa: number,
  from: number,
  end: number,
): number {
  const lowest = LOWEST_FRACTION_OF_MAXIMUM * stress[end]!
  let highest = Number.NEGATIVE_INFINITY
  for (let i = Math.max(from, 1); i < end; i++) {
    if (plasticStrainAt(strain, stress, modulusMPa, i) > EARLY_PLASTIC_STRAIN) break
    const isNewHighest = stress[i]! > highest
    highest = Math.max(highest, stress[i]!)
    if (stress[i]! < lowest || !isNewHighest || !isLocalMaximum(stress, i)) continue
    if (dropsAfter(stress, i, end)) return i
  }
  return -1
}

/** The last zero-slope point of the yield region: the last local minimum before the stress leaves it above ReH. */
function lastZeroSlopeIndex(stress: Float64Array, upper: number, end: number): number {
  let leave = upper + 1
  while (leave < end && stress[leave]! <= stress[upper]!) leave++
  for (let i = leave - 1; i > upper; i--) if (isLocalMinimum(stress, i)) return i
  return upper + 1
}

/** ReL (ISO 6892-1): lowest stress in the yield region, the first minimum (initial transient) ignored. */
function lowerYield(stress: Float64Array, upper: number, last: number): number {
  const minima: number[] = []
  for (let i = upper + 1; i <= last; i++) if (isLocalMinimum(stress, i)) minima.push(stress[i]!)
  const counted = minima.length > 1 ? minima.slice(1) : minima
  return counted.length > 0 ? counted.reduce((low, value) => Math.min(low, value)) : stress[last]!
}

/**
 * End of the yield-point elongation by the tangent construction of ASTM E8/E8M: a horizontal
 * line through the last zero-slope point meets the tangent to the hardening curve at its
 * steepest point (the inflection); an abrupt start of hardening gives the zero-slope point itself.
 */
function tangentEnd(strain: Float64Array, stress: Float64Array, zero: number, end: number): number {
  let best = { slope: 0, strain: strain[zero]!, stress: stress[zero]! }
  for (let i = zero; i + TANGENT_POINTS - 1 <= end; i++) {
    const line = fitLine(strain, stress, i, i + TANGENT_POINTS - 1)
    if (line !== null && line.slope > best.slope) {
      const middle = i + Math.floor(TANGENT_POINTS / 2)
      best = {
        slope: line.slope,
        strain: strain[middle]!,
        stress: line.slope * strain[middle]! + line.intercept,
      }
    }
    if (stress[i]! > stress[zero]! * 1.05) break
  }
  if (best.slope <= 0) return strain[zero]!
  return Math.max(strain[zero]!, best.strain - (best.stress - stress[zero]!) / best.slope)
}

/**
 * Discontinuous yielding (ISO 6892-1 ReH, ReL; ASTM E8/E8M yield-point elongation), searched
 * from the start of the elastic fit to maximum force. Null when yielding is continuous.
 */
export function discontinuousYield(
  strain: Float64Array,
  stress: Float64Array,
  modulusMPa: number,
  from: number,
  maximumIndex: number,
): DiscontinuousYield | null {
  const upper = upperYieldIndex(strain, stress, modulusMPa, from, maximumIndex)
  if (upper < 0) return null
  const zero = lastZeroSlopeIndex(stress, upper, maximumIndex)
  const endStrain = tangentEnd(strain, stress, zero, maximumIndex)
  return {
    upperYieldMPa: stress[upper]!,
    lowerYieldMPa: lowerYield(stress, upper, zero),
    yieldPointElongationPct: (endStrain - strain[upper]!) * 100,
    endStrain,
  }
}
