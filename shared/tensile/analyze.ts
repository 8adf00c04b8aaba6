import { curveAfterFit, type CompensatedCurve } from './compensated-curve'
import { buildCurve } from './curve'
import { modulusOfResilience, toughness } from './energy'
import { fractureIndex } from './fracture'
import { importRecord } from './import-record'
import { maximumForce } from './maximum-force'
import type { TensileResult } from './result'
import { trueStressStrain } from './true-curve'
import type { AnalysisOptions, EngineeringCurve, ImportOptions, ResolvedGeometry } from './types'
import { offsetYieldStrength, proportionalLimit } from './yield-strength'

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

function offsetYields(
  c: CompensatedCurve,
  offsetsPct: readonly number[],
  to: number,
  warnings: string[],
) {
  return offsetsPct.map((offset) => {
    const value = offsetYieldStrength(c.strain, c.stress, c.modulusMPa, offset, c.fit.fromIndex, to)
    if (value === null) warnings.push(`Rp${offset} is not reached before fracture`)
    return value
  })
}

/** Every issue-4 property of one engineering curve (see result.ts for the meaning of each key). */
export function analyseCurve(
  curve: EngineeringCurve,
  options: AnalysisOptions = {},
): TensileResult {
  const warnings: string[] = []
  const c = curveAfterFit(curve, options.fitRange, warnings)
  const E = c.modulusMPa
  const top = maximumForce(c.strain, c.stress)
  const fracture = fractureIndex(c.stress, top.index)
  const offsetsPct = options.offsetsPct ?? [DEFAULT_OFFSET_PCT]
  const yields = offsetYields(c, offsetsPct, fracture, warnings)
  const yieldStrengthMPa = yields[0] ?? null
  const atMaximum = trueStressStrain(c.strain, c.stress, top.index)
  const fractureStress = c.stress[fracture]!
  return {
    modulusGPa: E / 1000,
    modulusFit: {
      fromMPa: c.fit.fromMPa,
      toMPa: c.fit.toMPa,
      rSquared: c.fit.rSquared,
      points: c.fit.points,
    },
    strainOriginShiftPct: c.originStrain * 100,
    proportionalLimitMPa: proportionalLimit(c.strain, c.stress, E, c.fit.fromIndex, top.index),
    offsetPct: offsetsPct[0] ?? DEFAULT_OFFSET_PCT,
    yieldStrengthMPa,
    yieldStrengthsMPa: Object.fromEntries(
      offsetsPct.map((offset, k) => [String(offset), yields[k] ?? null]),
    ),
    tensileStrengthMPa: top.stressMPa,
    maximumForceN: curve.geometry.areaMm2 === null ? null : top.stressMPa * curve.geometry.areaMm2,
    uniformElongationPct: (top.strain - top.stressMPa / E) * 100,
    totalElongationAtMaxForcePct: top.strain * 100,
    trueStressAtMaxForceMPa: atMaximum.trueStressMPa[top.index]!,
    trueStrainAtMaxForce: atMaximum.trueStrain[top.index]!,
    fractureStrengthMPa: fractureStress,
    elongationAfterFracturePct: (c.strain[fracture]! - fractureStress / E) * 100,
    elongationAfterFractureFromLuPct: elongationFromMarks(curve.geometry),
    reductionOfAreaPct: reductionOfArea(curve.geometry),
    resilienceMJm3: modulusOfResilience(yieldStrengthMPa, E),
    toughnessMJm3: toughness(c.strain, c.stress, fracture),
    crossSectionMm2: curve.geometry.areaMm2,
    extensometerGaugeLengthMm: curve.geometry.extensometerGaugeLengthMm,
    originalGaugeLengthMm: curve.geometry.originalGaugeLengthMm,
    points: c.stress.length,
    warnings,
  }
}

/** Reads a delimited record and analyses it: the one call the server and the command line make. */
export function analyseRecord(
  text: string,
  options: ImportOptions & AnalysisOptions = {},
): TensileResult {
  const record = importRecord(text, options)
  const result = analyseCurve(buildCurve(record), options)
  return { ...result, warnings: [...record.warnings, ...result.warnings] }
}
