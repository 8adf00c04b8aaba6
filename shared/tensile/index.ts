/*
 * Public API of the tensile engine: pure functions, no DOM and no Node-only modules, so the
 * browser previews with the same code the server runs for the authoritative result.
 */
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
  describeRule,
  evaluateConformity,
  type ConformityItem,
  type ConformityResult,
  type DecisionRule,
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
} from './statistics'
export { discontinuousYield, type DiscontinuousYield } from './discontinuous-yield'
export { strainHardening, defaultHardeningRange, type HardeningFit } from './strain-hardening'
