/** Which yield a specification states its minimum for. */
export type YieldKind = 'Rp0.2' | 'ReH' | 'ReL' | 'Rt0.5'

/** Gauge length an elongation limit applies to: fixed, k·√S0, or a multiple of the diameter. */
export type GaugeBasis =
  | { kind: 'fixed'; lengthMm: number }
  | { kind: 'proportional'; k: number }
  | { kind: 'diameters'; multiple: number }

export interface ElongationRequirement {
  minPct: number
  basis: GaugeBasis
}

/** One material specification's tensile (and hardness) limits, with where the numbers came from. */
export interface SpecificationRecord {
  designation: string
  standard: string
  edition: string | null
  grade: string
  productForm: string
  thicknessBandMm: { over: number | null; upTo: number | null } | null
  yield: { minMPa: number; kind: YieldKind } | null
  tensileStrength: { minMPa: number | null; maxMPa: number | null }
  /** Alternatives on different gauge bases; the one matching the specimen is compared. */
  elongation: ElongationRequirement[]
  reductionOfAreaMinPct: number | null
  hardness: { min: number | null; max: number | null; scale: string } | null
  source: string
}

export function describeBasis(basis: GaugeBasis): string {
  switch (basis.kind) {
    case 'fixed':
      return `${basis.lengthMm} mm`
    case 'proportional':
      return `${basis.k}√S0`
    case 'diameters':
      return `${basis.multiple}D`
  }
}
