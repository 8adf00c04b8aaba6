/** Reporting increments; the library keeps full precision and rounds only for the report. */
export interface RoundingSettings {
  strengthMPa: number
  elongationPct: number
  yieldPointElongationPct: number
  reductionOfAreaPct: number
  modulusGPa: number
}

/*
 * ISO 6892-1 reporting (rounding clause, recalled from memory, not read from the standard):
 * strengths to 1 MPa, yield-point extension to 0.1 %, other elongations to 0.5 %; reduction of
 * area to 1 % (our default). The modulus to 1 GPa is common practice.
 */
export const ISO_6892_ROUNDING: Readonly<RoundingSettings> = {
  strengthMPa: 1,
  elongationPct: 0.5,
  yieldPointElongationPct: 0.1,
  reductionOfAreaPct: 1,
  modulusGPa: 1,
}

/**
 * Rounds to a multiple of `increment`; an exact half goes to the even multiple (ASTM E29
 * rounding method, recalled from memory). "Exact" allows for binary representation error.
 */
export function roundToIncrement(value: number, increment: number): number {
  const steps = value / increment
  const floor = Math.floor(steps)
  const fraction = steps - floor
  const tolerance = 1e-9 * Math.max(1, Math.abs(steps))
  let rounded: number
  if (Math.abs(fraction - 0.5) <= tolerance) rounded = floor % 2 === 0 ? floor : floor + 1
  else rounded = Math.round(steps)
  const result = rounded * increment
  // Clean up 0.30000000000000004-style representation of the product.
  return Number(result.toPrecision(12))
}

/** Rounds a nullable value; null stays null. */
export function roundOrNull(value: number | null, increment: number): number | null {
  return value === null ? null : roundToIncrement(value, increment)
}
