/**
 * Properties of one test in SI units at full precision; `null` where a property does not apply
 * or was not reached. The names are the command line's JSON keys (a public contract).
 */
export interface TensileResult {
  modulusGPa: number
  /** The window of the elastic fit, so anyone can check or repeat it. */
  modulusFit: {
    fromMPa: number
    toMPa: number
    rSquared: number
    points: number
    /** 'automatic' (searched) or 'fit range' (given with the fitRange option). */
    chosenBy: 'automatic' | 'fit range'
    /** No sharp end to the linear part was found: E comes from the straight start of the curve. */
    rounded: boolean
    /** First and last data point of the window, counted from 1 in the record's body. */
    fromPoint: number
    toPoint: number
    /** Strain at the first and last point as recorded (before toe compensation), percent. */
    fromStrainPct: number
    toStrainPct: number
  }
  /** Toe compensation: how far the strain origin moved, in percent strain. */
  strainOriginShiftPct: number
  proportionalLimitMPa: number | null
  offsetPct: number
  yieldStrengthMPa: number | null
  /** Rp at every requested offset, keyed by the offset in percent as written ("0.2", "1"). */
  yieldStrengthsMPa: Record<string, number | null>
  /** Proof strength at 0.5 % total extension, Rt0.5 (ISO 6892-1). */
  rt05MPa: number | null
  discontinuousYielding: boolean
  upperYieldMPa: number | null
  lowerYieldMPa: number | null
  yieldPointElongationPct: number | null
  tensileStrengthMPa: number
  maximumForceN: number | null
  uniformElongationPct: number
  totalElongationAtMaxForcePct: number
  trueStressAtMaxForceMPa: number
  trueStrainAtMaxForce: number
  fractureStrengthMPa: number
  elongationAfterFracturePct: number
  elongationAfterFractureFromLuPct: number | null
  reductionOfAreaPct: number | null
  strainHardeningExponent: number | null
  strengthCoefficientMPa: number | null
  hardeningFit: { fromPct: number; toPct: number; points: number; rSquared: number } | null
  resilienceMJm3: number | null
  toughnessMJm3: number
  crossSectionMm2: number | null
  diameterMm: number | null
  extensometerGaugeLengthMm: number | null
  originalGaugeLengthMm: number | null
  points: number
  warnings: string[]
}
