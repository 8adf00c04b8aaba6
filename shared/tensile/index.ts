/*
 * Public API of the tensile engine: pure functions, no DOM and no Node-only modules, so the
 * browser previews with the same code the server runs for the authoritative result.
 */
export {
  analyseSpecimens,
  reportSummary,
  specimenResults,
  type SetSummary,
  type SpecimenRecord,
  type SpecimenResult,
  type TensileReport,
} from './pipeline'
export {
  checkTensileOptions,
  TENSILE_OPTION_NAMES,
  TensileOptions,
  type TensileOptionName,
} from './options'
export { resolveOptions, type ResolvedOptions } from './resolve-options'
export {
  parseFitRange,
  parseHardeningRange,
  parseOffsets,
  parseUncertainty,
  UNCERTAINTY_KEYS,
  type UncertaintyKey,
} from './option-values'
export {
  PROPERTY_CATALOGUE,
  propertyEntry,
  propertyLabel,
  type PropertyEntry,
  type PropertyQuantity,
} from './properties'
export { formatSpread, formatValue, reportUnit, type UnitSystem } from './format'
export { closingCaution, VERDICT_CAUTION, type CitedSpecification } from './cautions'
export { quoted, withoutControlCharacters } from './printable'
export { RECORD_LIMITS } from './limits'
export { analyseCurve, analyseRecord } from './analyze'
export { buildCurve } from './curve'
export { TensileInputError } from './errors'
export { mergeGeometry, resolveGeometry, sectionArea } from './geometry'
export { importRecord, MINIMUM_POINTS } from './import-record'
export { fitModulusAutomatically, fitModulusInRange, type ModulusFit } from './modulus'
export { parseQuantity, quantityUnit } from './quantity'
export type { TensileResult } from './result'
export { ISO_6892_ROUNDING, roundOrNull, roundToIncrement, type RoundingSettings } from './rounding'
export { trueStressStrain, type TrueCurve } from './true-curve'
export type * from './types'
export {
  MM_PER_INCH,
  MPA_PER_KSI,
  MPA_PER_PSI,
  NEWTON_PER_KGF,
  NEWTON_PER_LBF,
  unitFactor,
  type Quantity,
} from './units'
export {
  conformityQuantity,
  describeRule,
  evaluateConformity,
  type ConformityBasis,
  type ConformityItem,
  type ConformityResult,
  type DecisionRule,
  type MeasurementUncertainty,
  type OverallVerdict,
  type Verdict,
} from './conformity'
export type {
  ElongationRequirement,
  GaugeBasis,
  SpecificationRecord,
  YieldKind,
} from './specification'
export { findSpecification, STARTER_SPECIFICATIONS } from './specifications'
export {
  summariseSpecimens,
  summariseValues,
  SUMMARISED_PROPERTIES,
  type PropertySummary,
  type SpecimenSummary,
} from './statistics'
export { discontinuousYield, type DiscontinuousYield } from './discontinuous-yield'
export { strainHardening, defaultHardeningRange, type HardeningFit } from './strain-hardening'
export { previewRecord, thinCurve, type CurvePoint, type RecordPreview } from './preview'
