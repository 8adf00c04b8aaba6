import { firstCrossing } from './crossing'
import { plasticStrainAt } from './toe'

/** Plastic strain at the end of proportionality (ε − σ/E beyond 0.01 %, common practice). */
export const PROPORTIONAL_LIMIT_PLASTIC_STRAIN = 1e-4

/**
 * Proportional limit: the highest stress below which the plastic strain ε − σ/E stays under
 * 0.01 %. Searched from the start of the elastic fit, so toe samples (below the line) are
 * not mistaken for plasticity.
 */
export function proportionalLimit(
  strain: Float64Array,
  stress: Float64Array,
  modulusMPa: number,
  from: number,
  to: number,
): number | null {
  const plastic = (i: number) => plasticStrainAt(strain, stress, modulusMPa, i)
  return (
    firstCrossing(stress, plastic, PROPORTIONAL_LIMIT_PLASTIC_STRAIN, from, to)?.stressMPa ?? null
  )
}

/**
 * Offset yield strength Rp (ASTM E8/E8M offset method; ISO 6892-1 proof strength, plastic
 * extension): where the line of slope E shifted by the offset meets the curve, i.e. where the
 * plastic strain first reaches the offset, interpolated between samples.
 */
export function offsetYieldStrength(
  strain: Float64Array,
  stress: Float64Array,
  modulusMPa: number,
  offsetPct: number,
  from: number,
  to: number,
): number | null {
  const plastic = (i: number) => plasticStrainAt(strain, stress, modulusMPa, i)
  return firstCrossing(stress, plastic, offsetPct / 100, from, to)?.stressMPa ?? null
}

/** Proof strength, total extension Rt (ISO 6892-1): stress where the total strain first reaches the value. */
export function totalExtensionStrength(
  strain: Float64Array,
  stress: Float64Array,
  totalPct: number,
  from: number,
  to: number,
): number | null {
  return firstCrossing(stress, (i) => strain[i]!, totalPct / 100, from, to)?.stressMPa ?? null
}
