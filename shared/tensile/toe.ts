/**
 * Toe compensation (ASTM E8/E8M, toe region): the strain origin moves to where the fitted
 * elastic line meets zero stress, so slack and seating at the start of the test do not add to
 * any strain-based property. Returns the shift and the compensated strain, written over the
 * given strain when the caller gives it up (`reuse`).
 */
export function compensateToe(
  strain: Float64Array,
  modulusMPa: number,
  interceptMPa: number,
  reuse = false,
): { originStrain: number; strain: Float64Array } {
  const originStrain = -interceptMPa / modulusMPa
  const compensated = reuse ? strain : new Float64Array(strain.length)
  for (let i = 0; i < strain.length; i++) compensated[i] = strain[i]! - originStrain
  return { originStrain, strain: compensated }
}

/** Plastic strain ε − σ/E, the quantity every offset property is defined on (ISO 6892-1). */
export function plasticStrainAt(
  strain: Float64Array,
  stress: Float64Array,
  modulusMPa: number,
  i: number,
): number {
  return strain[i]! - stress[i]! / modulusMPa
}
