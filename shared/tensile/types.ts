/**
 * A record's text in chunks, in order (a file read piece by piece), with the record's length
 * in characters when known (an upper bound will do), so its columns can be sized once.
 */
export interface RecordChunks extends Iterable<string> {
  readonly characters?: number
}

/** A record's text: whole, or in chunks so that a long record is never held as one string. */
export type RecordSource = string | RecordChunks

/** Column separators the importer recognises, in the order it prefers them. */
export type Delimiter = '\t' | ';' | ',' | '|'
export type DecimalSeparator = '.' | ','

/** The columns the engine can use; every other column of a record is ignored. */
export type ColumnRole = 'force' | 'extension' | 'strain' | 'stress' | 'time'

/** Cross-section dimensions as given (mm, mm²); the area is worked out in geometry.ts. */
export interface SectionInput {
  diameterMm?: number
  widthMm?: number
  thicknessMm?: number
  outerDiameterMm?: number
  wallMm?: number
  areaMm2?: number
}

export interface GeometryInput {
  section?: SectionInput
  /** Extensometer gauge length Le: the base of the strain. */
  extensometerGaugeLengthMm?: number
  /** Specimen's marked gauge length L0 for elongation after fracture; Le when not given. */
  originalGaugeLengthMm?: number
  finalGaugeLengthMm?: number
  finalSection?: SectionInput
}

export interface ResolvedGeometry {
  areaMm2: number | null
  diameterMm: number | null
  extensometerGaugeLengthMm: number | null
  originalGaugeLengthMm: number | null
  finalGaugeLengthMm: number | null
  finalAreaMm2: number | null
}

export interface ImportOptions {
  delimiter?: Delimiter
  decimal?: DecimalSeparator
  /** A column's header name or its 1-based position, per role. */
  columns?: Partial<Record<ColumnRole, string>>
  /** A unit that replaces the one in the header, per role. */
  units?: Partial<Record<ColumnRole, string>>
  /** Geometry that overrides the file's preamble (a section replaces the whole section). */
  geometry?: GeometryInput
}

export interface UsedColumn {
  role: ColumnRole
  position: number
  name: string
  unit: string
}

/** A raw record read from a file: the chosen columns in N, mm, fraction, MPa and s. */
export interface TensileRecord {
  columns: UsedColumn[]
  force: Float64Array | null
  extension: Float64Array | null
  strain: Float64Array | null
  stress: Float64Array | null
  geometry: ResolvedGeometry
  points: number
  warnings: string[]
}

/** The engineering curve every property is computed from. */
export interface EngineeringCurve {
  /** Engineering strain ΔL/Le as a fraction, before toe compensation. */
  strain: Float64Array
  /** Engineering stress F/S0 in MPa. */
  stress: Float64Array
  geometry: ResolvedGeometry
}

export type FitRange =
  | { quantity: 'stress'; fromMPa: number; toMPa: number }
  | { quantity: 'strain'; from: number; to: number }

export interface AnalysisOptions {
  /** Offsets for Rp in percent; the first one is the headline yield strength. Default [0.2]. */
  offsetsPct?: number[]
  /** Overrides the automatic search for the elastic window. */
  fitRange?: FitRange
  /** Overrides the default engineering-strain range of the hardening fit, in percent. */
  hardeningRangePct?: { from: number; to: number }
}
