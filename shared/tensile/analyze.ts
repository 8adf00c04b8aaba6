import { curveAfterFit, type CompensatedCurve } from './compensated-curve'
import { buildCurve } from './curve'
import { discontinuousYield } from './discontinuous-yield'
import { modulusOfResilience, toughness } from './energy'
import { fractureIndex } from './fracture'
import { importRecord } from './import-record'
import { maximumForce, type MaximumForcePoint } from './maximum-force'
import type { TensileResult } from './result'
import { defaultHardeningRange, strainHardening } from './strain-hardening'
import { trueValuesAt } from './true-curve'
import type {
  AnalysisOptions,
  EngineeringCurve,
  ImportOptions,
  RecordSource,
  ResolvedGeometry,
} from './types'
import { offsetYieldStrength, proportionalLimit, totalExtensionStrength } from './yield-strength'

const DEFAULT_OFFSET_PCT = 0.2

/** Elongation after fracture from marks, (Lu − L0)/L0 (ISO 6892-1, percentage elongation after fracture). */
function elongationFromMarks(geometry: ResolvedGeometry): number | null {
  const { finalGaugeLengthMm: lu, originalGaugeLengthMm: l0 } = geometry
  return lu === null || l0 === null ? null : ((lu - l0) / l0) * 100
}

/** Reduction of area Z = (S0 − Su)/S0 (ISO 6892-1, percentage reduction of area). */
function reductionOfArea(geometry: ResolvedGeometry): number | null {
  const { areaMm2: s0, finalAreaMm2: su } = geometry
  return s0 === null || su === null ? null : ((s0 - su) / s0) * 100
}

/** Rp at every offset (ASTM E8/E8M, ISO 6892-1), searched up to fracture. */
function yieldStrengths(
  c: CompensatedCurve,
  offsetsPct: readonly number[],
  fracture: number,
  warnings: string[],
) {
  const values = offsetsPct.map((offset) => {
    const value = offsetYieldStrength(
      c.strain,
      c.stress,
      c.modulusMPa,
      offset,
      c.fit.fromIndex,
      fracture,
    )
    if (value === null) warnings.push(`Rp${offset} is not reached before fracture`)
    return value
  })
  return {
    offsetPct: offsetsPct[0] ?? DEFAULT_OFFSET_PCT,
    yieldStrengthMPa: values[0] ?? null,
    yieldStrengthsMPa: Object.fromEntries(
      offsetsPct.map((offset, k) => [String(offset), values[k] ?? null]),
    ),
    rt05MPa: totalExtensionStrength(c.strain, c.stress, 0.5, c.fit.fromIndex, fracture),
  }
}

function yieldPoint(c: CompensatedCurve, top: MaximumForcePoint) {
  const found = discontinuousYield(c.strain, c.stress, c.modulusMPa, c.fit.fromIndex, top.index)
  return {
    discontinuousYielding: found !== null,
    upperYieldMPa: found?.upperYieldMPa ?? null,
    lowerYieldMPa: found?.lowerYieldMPa ?? null,
    yieldPointElongationPct: found?.yieldPointElongationPct ?? null,
    yieldEndPct: found === null ? null : found.endStrain * 100,
  }
}

function hardening(
  c: CompensatedCurve,
  top: MaximumForcePoint,
  agPct: number,
  yieldEndPct: number | null,
  options: AnalysisOptions,
  warnings: string[],
) {
  const range =
    options.hardeningRangePct ?? defaultHardeningRange(agPct, top.strain * 100, yieldEndPct)
  const fit = strainHardening(c.strain, c.stress, top.index, range)
  if (fit === null)
    warnings.push('Too few points for the strain-hardening fit (ASTM E646 asks for five)')
  return {
    strainHardeningExponent: fit?.strainHardeningExponent ?? null,
    strengthCoefficientMPa: fit?.strengthCoefficientMPa ?? null,
    hardeningFit: fit?.fit ?? null,
  }
}

function atMaximumForce(c: CompensatedCurve, top: MaximumForcePoint, geometry: ResolvedGeometry) {
  const atTop = trueValuesAt(c.strain, c.stress, top.index)
  return {
    tensileStrengthMPa: top.stressMPa,
    maximumForceN: geometry.areaMm2 === null ? null : top.stressMPa * geometry.areaMm2,
    uniformElongationPct: (top.strain - top.stressMPa / c.modulusMPa) * 100,
    totalElongationAtMaxForcePct: top.strain * 100,
    trueStressAtMaxForceMPa: atTop.trueStressMPa,
    trueStrainAtMaxForce: atTop.trueStrain,
  }
}

function atFracture(c: CompensatedCurve, fracture: number, geometry: ResolvedGeometry) {
  const stress = c.stress[fracture]!
  return {
    fractureStrengthMPa: stress,
    elongationAfterFracturePct: (c.strain[fracture]! - stress / c.modulusMPa) * 100,
    elongationAfterFractureFromLuPct: elongationFromMarks(geometry),
    reductionOfAreaPct: reductionOfArea(geometry),
    toughnessMJm3: toughness(c.strain, c.stress, fracture),
  }
}

function fitWindow(c: CompensatedCurve): TensileResult['modulusFit'] {
  const { fit } = c
  const recordedStrainPct = (i: number) => (c.strain[i]! + c.originStrain) * 100
  return {
    fromMPa: fit.fromMPa,
    toMPa: fit.toMPa,
    rSquared: fit.rSquared,
    points: fit.points,
    chosenBy: fit.chosenBy,
    rounded: fit.rounded,
    fromPoint: fit.fromIndex + 1,
    toPoint: fit.toIndex + 1,
    fromStrainPct: recordedStrainPct(fit.fromIndex),
    toStrainPct: recordedStrainPct(fit.toIndex),
  }
}

/** Every property of one engineering curve (see result.ts for the meaning of each key). */
export function analyseCurve(
  curve: EngineeringCurve,
  options: AnalysisOptions = {},
): TensileResult {
  return analyse(curve, options, false)
}

/** With `reuse`, the curve's strain array is overwritten by the compensated strain. */
function analyse(curve: EngineeringCurve, options: AnalysisOptions, reuse: boolean): TensileResult {
  const warnings: string[] = []
  const c = curveAfterFit(curve, options.fitRange, warnings, reuse)
  const top = maximumForce(c.strain, c.stress)
  const fracture = fractureIndex(c.stress, top.index)
  const yields = yieldStrengths(c, options.offsetsPct ?? [DEFAULT_OFFSET_PCT], fracture, warnings)
  const { yieldEndPct, ...yieldPointProperties } = yieldPoint(c, top)
  const maximum = atMaximumForce(c, top, curve.geometry)
  return {
    modulusGPa: c.modulusMPa / 1000,
    modulusFit: fitWindow(c),
    strainOriginShiftPct: c.originStrain * 100,
    proportionalLimitMPa: proportionalLimit(
      c.strain,
      c.stress,
      c.modulusMPa,
      c.fit.fromIndex,
      top.index,
    ),
    ...yields,
    ...yieldPointProperties,
    ...maximum,
    ...atFracture(c, fracture, curve.geometry),
    ...hardening(c, top, maximum.uniformElongationPct, yieldEndPct, options, warnings),
    resilienceMJm3: modulusOfResilience(yields.yieldStrengthMPa, c.modulusMPa),
    crossSectionMm2: curve.geometry.areaMm2,
    diameterMm: curve.geometry.diameterMm,
    extensometerGaugeLengthMm: curve.geometry.extensometerGaugeLengthMm,
    originalGaugeLengthMm: curve.geometry.originalGaugeLengthMm,
    points: c.stress.length,
    warnings,
  }
}

/** Reads a delimited record and analyses it: the one call the server and the command line make. */
export function analyseRecord(
  source: RecordSource,
  options: ImportOptions & AnalysisOptions = {},
): TensileResult {
  const record = importRecord(source, options)
  // The record is ours alone: its arrays become the curve, converted in place.
  const result = analyse(buildCurve(record, true), options, true)
  return { ...result, warnings: [...record.warnings, ...result.warnings] }
}
