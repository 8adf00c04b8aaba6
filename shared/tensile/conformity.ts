import { VERDICT_CAUTION } from './cautions'
import type { UncertaintyKey } from './option-values'
import type { PropertyQuantity } from './properties'
import type { TensileResult } from './result'
import { ISO_6892_ROUNDING, roundToIncrement, type RoundingSettings } from './rounding'
import {
  describeBasis,
  type ElongationRequirement,
  type GaugeBasis,
  type SpecificationRecord,
} from './specification'

/** How a measured value is compared with a limit (ISO/IEC 17025 7.8.6 asks that it be stated). */
export type DecisionRule = 'simple' | 'guard'

/** The lab's expanded uncertainty U per property, and where it comes from. */
export interface MeasurementUncertainty {
  /** MPa for strengths, percentage points for A and Z. */
  expanded: Partial<Record<UncertaintyKey, number>>
  /** The uncertainty budget or other source of U; null when nobody stated it. */
  source: string | null
}

/** Everything a conformity statement rests on besides the result and the specification. */
export interface ConformityBasis {
  rule: DecisionRule
  /** Input to the guard band; reported beside each item under either rule. */
  uncertainty: MeasurementUncertainty | null
  /** The edition of the specification that the contract or the client's specification cites. */
  edition: string | null
}

export type Verdict = 'pass' | 'fail' | 'inconclusive' | 'not comparable' | 'not measured'
export type OverallVerdict = 'pass' | 'fail' | 'inconclusive' | 'incomplete'

export interface ConformityItem {
  property: string
  value: number | null
  limit: number
  bound: 'min' | 'max'
  verdict: Verdict
  /** Expanded uncertainty U of the value, in the value's unit; null when none was stated. */
  uncertainty: number | null
  note?: string
}

export interface ConformityResult {
  specification: {
    designation: string
    standard: string
    grade: string
    source: string
    /** The edition the contract or the client's specification cites; null when not stated. */
    edition: string | null
  }
  rule: string
  uncertainty: MeasurementUncertainty | null
  overall: OverallVerdict
  /** Why the verdict is indicative for specimens cut from a failed part. */
  caution: string
  items: ConformityItem[]
}

type Kind = 'strength' | 'elongation' | 'reduction'

interface Check {
  property: string
  /** Which stated uncertainty applies; null when none can (hardness). */
  uncertaintyKey: UncertaintyKey | null
  value: number | null
  limit: number
  bound: 'min' | 'max'
  kind: Kind
  note?: string
  /** Set when the value cannot be compared at all (a different gauge-length basis). */
  preset?: Verdict
}

function increment(kind: Kind, rounding: RoundingSettings): number {
  if (kind === 'strength') return rounding.strengthMPa
  return kind === 'elongation' ? rounding.elongationPct : rounding.reductionOfAreaPct
}

/** Simple acceptance: the value rounded as the standard reports it meets the limit (ASTM E29 rounding method). */
function simpleVerdict(check: Check, value: number, rounding: RoundingSettings): Verdict {
  const rounded = roundToIncrement(value, increment(check.kind, rounding))
  const meets = check.bound === 'min' ? rounded >= check.limit : rounded <= check.limit
  return meets ? 'pass' : 'fail'
}

/** Guard band: pass only when clear of the limit by more than U, fail only when beyond it by more than U. */
function guardedVerdict(check: Check, value: number, u: number): Verdict {
  const margin = check.bound === 'min' ? value - check.limit : check.limit - value
  if (margin > u) return 'pass'
  if (margin < -u) return 'fail'
  return 'inconclusive'
}

function judge(check: Check, basis: ConformityBasis, rounding: RoundingSettings): ConformityItem {
  const { kind: _kind, preset, uncertaintyKey, ...rest } = check
  const u = uncertaintyKey === null ? null : (basis.uncertainty?.expanded[uncertaintyKey] ?? null)
  const item = { ...rest, uncertainty: u }
  if (preset !== undefined) return { ...item, verdict: preset }
  if (check.value === null) return { ...item, verdict: 'not measured' }
  if (basis.rule === 'simple')
    return { ...item, verdict: simpleVerdict(check, check.value, rounding) }
  if (u === null) {
    const note = `no expanded uncertainty stated for ${uncertaintyKey ?? check.property}`
    return { ...item, verdict: 'inconclusive', note }
  }
  return { ...item, verdict: guardedVerdict(check, check.value, u) }
}

/**
 * The yield the specification asks for. With continuous yielding there is no ReH and Rp0.2
 * stands in for it (common practice); with discontinuous yielding Rp is still there, and the
 * item names the yield that was compared.
 */
function yieldCheck(spec: SpecificationRecord, result: TensileResult): Check[] {
  if (spec.yield === null) return []
  const base = { limit: spec.yield.minMPa, bound: 'min' as const, kind: 'strength' as const }
  const rp02 = result.yieldStrengthsMPa['0.2'] ?? null
  switch (spec.yield.kind) {
    case 'ReH':
      return result.discontinuousYielding
        ? [{ ...base, property: 'ReH', uncertaintyKey: 'ReH', value: result.upperYieldMPa }]
        : [
            {
              ...base,
              property: 'Rp0.2',
              uncertaintyKey: 'Rp0.2',
              value: rp02,
              note: 'continuous yielding: Rp0.2 compared in place of ReH',
            },
          ]
    case 'ReL':
      // The stated U for ReH stands for both yield points (common practice): one more key would
      // change what "5MPa" expands to in the command line's answer.
      return result.discontinuousYielding
        ? [{ ...base, property: 'ReL', uncertaintyKey: 'ReH', value: result.lowerYieldMPa }]
        : [
            {
              ...base,
              property: 'Rp0.2',
              uncertaintyKey: 'Rp0.2',
              value: rp02,
              note: 'continuous yielding: Rp0.2 compared in place of ReL',
            },
          ]
    case 'Rp0.2':
      return [
        {
          ...base,
          property: 'Rp0.2',
          uncertaintyKey: 'Rp0.2',
          value: rp02,
          note: result.discontinuousYielding
            ? 'discontinuous yielding; the specification asks for Rp0.2'
            : undefined,
        },
      ]
    case 'Rt0.5':
      return [{ ...base, property: 'Rt0.5', uncertaintyKey: 'Rt0.5', value: result.rt05MPa }]
  }
}

function tensileChecks(spec: SpecificationRecord, result: TensileResult): Check[] {
  const { minMPa, maxMPa } = spec.tensileStrength
  const value = result.tensileStrengthMPa
  const base = { property: 'Rm', uncertaintyKey: 'Rm' as const, value, kind: 'strength' as const }
  const checks: Check[] = []
  if (minMPa !== null) checks.push({ ...base, limit: minMPa, bound: 'min' })
  if (maxMPa !== null) checks.push({ ...base, limit: maxMPa, bound: 'max' })
  return checks
}

/** Gauge length a basis stands for on this specimen, in mm; null when it cannot be worked out. */
function basisLength(basis: GaugeBasis, result: TensileResult): number | null {
  const area = result.crossSectionMm2
  switch (basis.kind) {
    case 'fixed':
      return basis.lengthMm
    case 'proportional':
      return area === null ? null : basis.k * Math.sqrt(area)
    case 'diameters': {
      const diameter = result.diameterMm ?? (area === null ? null : Math.sqrt((4 * area) / Math.PI))
      return diameter === null ? null : basis.multiple * diameter
    }
  }
}

/*
 * Same basis: a fixed gauge within 1 % (common practice); a proportional one within 10 %, the
 * margin ISO 6892-1 allows when L0 is rounded to a multiple of 5 mm (recalled from memory).
 */
function sameBasis(requirement: ElongationRequirement, result: TensileResult): boolean {
  const wanted = basisLength(requirement.basis, result)
  const tested = result.originalGaugeLengthMm
  if (wanted === null || tested === null) return false
  const tolerance = requirement.basis.kind === 'fixed' ? 0.01 : 0.1
  return Math.abs(tested - wanted) <= tolerance * wanted
}

/** Elongation after fracture, from the marks when measured, on the specimen's gauge basis. */
function elongationCheck(spec: SpecificationRecord, result: TensileResult): Check[] {
  const first = spec.elongation[0]
  if (first === undefined) return []
  const value = result.elongationAfterFractureFromLuPct ?? result.elongationAfterFracturePct
  const matching = spec.elongation.find((requirement) => sameBasis(requirement, result))
  const requirement = matching ?? first
  const check: Check = {
    property: `A (${describeBasis(requirement.basis)})`,
    uncertaintyKey: 'A',
    value,
    limit: requirement.minPct,
    bound: 'min',
    kind: 'elongation',
  }
  if (matching) return [check]
  const tested = result.originalGaugeLengthMm
  const note = `specimen gauge length ${tested === null ? 'unknown' : `${tested.toFixed(1)} mm`}`
  return [{ ...check, preset: 'not comparable', note }]
}

function otherChecks(spec: SpecificationRecord, result: TensileResult): Check[] {
  const checks: Check[] = []
  if (spec.reductionOfAreaMinPct !== null) {
    checks.push({
      property: 'Z',
      uncertaintyKey: 'Z',
      value: result.reductionOfAreaPct,
      limit: spec.reductionOfAreaMinPct,
      bound: 'min',
      kind: 'reduction',
    })
  }
  const hardness = spec.hardness
  if (hardness?.max != null) {
    checks.push({
      property: `hardness (${hardness.scale})`,
      uncertaintyKey: null,
      value: null,
      limit: hardness.max,
      bound: 'max',
      kind: 'strength',
      note: 'not part of a tensile test',
    })
  }
  return checks
}

/** Worst verdict first: any fail fails; then any inconclusive; then anything not compared. */
function overallVerdict(items: readonly ConformityItem[]): OverallVerdict {
  if (items.some((item) => item.verdict === 'fail')) return 'fail'
  if (items.some((item) => item.verdict === 'inconclusive')) return 'inconclusive'
  if (items.some((item) => item.verdict !== 'pass')) return 'incomplete'
  return 'pass'
}

function describeUncertainty(uncertainty: MeasurementUncertainty): string {
  const values = Object.entries(uncertainty.expanded).map(
    ([key, u]) => `${key} ${u}${key === 'A' || key === 'Z' ? ' %' : ' MPa'}`,
  )
  return `U = ${values.join(', ')} (${uncertainty.source ?? 'source not stated'})`
}

/** The decision rule in words, with the uncertainty it rests on (ISO/IEC 17025 7.8.6). */
export function describeRule(basis: Pick<ConformityBasis, 'rule' | 'uncertainty'>): string {
  const u = basis.uncertainty === null ? null : describeUncertainty(basis.uncertainty)
  if (basis.rule === 'guard')
    return `guard band of the expanded uncertainty (ISO/IEC 17025 7.8.6): ${u ?? 'no U stated'}`
  const simple = 'simple acceptance on values rounded as reported (ASTM E29)'
  return u === null
    ? simple
    : `${simple}; ${u}, reported beside each value, not used in the decision`
}

/** What a conformity item's value measures, for showing it (null: not a tensile quantity). */
export function conformityQuantity(property: string): PropertyQuantity | null {
  if (property.startsWith('A ')) return 'elongation'
  if (property === 'Z') return 'reduction'
  return property.startsWith('hardness') ? null : 'strength'
}

/** Compares one result with a specification under a stated decision rule. */
export function evaluateConformity(
  result: TensileResult,
  spec: SpecificationRecord,
  basis: ConformityBasis,
  rounding: RoundingSettings = ISO_6892_ROUNDING,
): ConformityResult {
  const checks = [
    ...yieldCheck(spec, result),
    ...tensileChecks(spec, result),
    ...elongationCheck(spec, result),
    ...otherChecks(spec, result),
  ]
  const items = checks.map((check) => judge(check, basis, rounding))
  return {
    specification: {
      designation: spec.designation,
      standard: spec.standard,
      grade: spec.grade,
      source: spec.source,
      edition: basis.edition ?? spec.edition,
    },
    rule: describeRule(basis),
    uncertainty: basis.uncertainty,
    overall: overallVerdict(items),
    caution: VERDICT_CAUTION,
    items,
  }
}
