import type { ConformityBasis } from './conformity'
import type { UnitSystem } from './format'
import {
  parseArea,
  parseDecimal,
  parseDelimiter,
  parseFitRange,
  parseHardeningRange,
  parseLength,
  parseOffsets,
  parseUncertainty,
} from './option-values'
import type { TensileOptions } from './options'
import type { SpecificationRecord } from './specification'
import { findSpecification } from './specifications'
import type {
  AnalysisOptions,
  ColumnRole,
  GeometryInput,
  ImportOptions,
  SectionInput,
} from './types'

/** The options read into the engine's own units and records. */
export interface ResolvedOptions {
  analysis: ImportOptions & AnalysisOptions
  specification: SpecificationRecord | null
  basis: ConformityBasis
  units: UnitSystem
}

const ROLES: readonly ColumnRole[] = ['force', 'extension', 'strain', 'stress', 'time']

function optional<T>(text: string | undefined, parse: (text: string) => T): T | undefined {
  return text === undefined ? undefined : parse(text)
}

function geometry(o: TensileOptions): GeometryInput {
  const section: SectionInput = {
    diameterMm: optional(o.diameter, parseLength),
    widthMm: optional(o.width, parseLength),
    thicknessMm: optional(o.thickness, parseLength),
    outerDiameterMm: optional(o.outerDiameter, parseLength),
    wallMm: optional(o.wall, parseLength),
    areaMm2: optional(o.area, parseArea),
  }
  const finalSection: SectionInput = {
    diameterMm: optional(o.finalDiameter, parseLength),
    widthMm: optional(o.finalWidth, parseLength),
    thicknessMm: optional(o.finalThickness, parseLength),
    areaMm2: optional(o.finalArea, parseArea),
  }
  return {
    section,
    finalSection,
    extensometerGaugeLengthMm: optional(o.gaugeLength, parseLength),
    originalGaugeLengthMm: optional(o.originalGaugeLength, parseLength),
    finalGaugeLengthMm: optional(o.finalGaugeLength, parseLength),
  }
}

function perRole(o: TensileOptions, suffix: 'Column' | 'Unit') {
  const entries = ROLES.map((role) => [role, o[`${role}${suffix}`]] as const)
  return Object.fromEntries(entries.filter(([, value]) => value !== undefined)) as Partial<
    Record<ColumnRole, string>
  >
}

function analysis(o: TensileOptions): ImportOptions & AnalysisOptions {
  return {
    geometry: geometry(o),
    delimiter: optional(o.delimiter, parseDelimiter),
    decimal: optional(o.decimal, parseDecimal),
    columns: perRole(o, 'Column'),
    units: perRole(o, 'Unit'),
    offsetsPct: optional(o.offset, parseOffsets),
    fitRange: optional(o.fitRange, parseFitRange),
    hardeningRangePct: optional(o.hardeningRange, parseHardeningRange),
  }
}

function basis(o: TensileOptions): ConformityBasis {
  const expanded = optional(o.uncertainty, parseUncertainty)
  return {
    rule: o.rule ?? 'simple',
    uncertainty: expanded === undefined ? null : { expanded, source: o.uncertaintySource ?? null },
    edition: o.specEdition ?? null,
  }
}

/** Reads validated options (see options.ts) into what the engine computes with. */
export function resolveOptions(options: TensileOptions): ResolvedOptions {
  return {
    analysis: analysis(options),
    specification: options.spec === undefined ? null : findSpecification(options.spec),
    basis: basis(options),
    units: options.units ?? 'si',
  }
}
