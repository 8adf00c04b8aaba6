import type { DecisionRule as CaseDecisionRule } from '../schemas/case-vocabulary'
import {
  evaluateConformity,
  type ConformityResult,
  type OverallVerdict,
} from '../tensile/conformity'
import { VERDICT_CAUTION } from '../tensile/cautions'
import { parseUncertainty } from '../tensile/option-values'
import type { TensileResult } from '../tensile/result'
import type { SpecificationRecord } from '../tensile/specification'

export const NOT_LINKED = 'No specification linked: conformity not judged.'

/** The library record and size band a case's material is linked to, as shown beside a verdict. */
export interface MaterialLinkSummary {
  specificationId: number
  designation: string
  standard: string
  edition: string | null
  grade: string
  bandIndex: number
  /** the band in words, e.g. "over 16 up to 40 mm" */
  band: string
  sectionSizeMm: number | null
  /** the record still carries starter limits nobody checked against the edition */
  unverified: boolean
}

/** A case's linked record, ready to judge with. */
export interface MaterialLink {
  summary: MaterialLinkSummary
  record: SpecificationRecord
}

/** What a case's records are judged with: its linked band (or why there is none) and its rule. */
export interface CaseMaterial {
  link: MaterialLink | null
  /** why nothing is judged, when `link` is null */
  reason: string
  rule: CaseDecisionRule
}

/** One record judged against the case's linked band, or why it was not judged. */
export type CaseConformity =
  | { judged: true; link: MaterialLinkSummary; conformity: ConformityResult }
  | { judged: false; reason: string }

/** The case's verdict over the records that count. */
export type CaseOverallConformity =
  | {
      judged: true
      link: MaterialLinkSummary
      /** null when no record has been judged yet */
      overall: OverallVerdict | null
      rule: string | null
      caution: string
    }
  | { judged: false; reason: string }

/** The uncertainty a record was analysed with (its options), for the case's guard band. */
function uncertaintyOf(options: Record<string, string>) {
  if (!options.uncertainty) return null
  try {
    return {
      expanded: parseUncertainty(options.uncertainty),
      source: options.uncertaintySource ?? null,
    }
  } catch {
    return null
  }
}

/**
 * A record's result judged against the case's linked record and band, under the case's decision
 * rule and the expanded uncertainty stored with the record's options (ISO/IEC 17025 7.8.6).
 */
export function judgeAgainstLink(
  result: TensileResult,
  options: Record<string, string>,
  material: CaseMaterial,
): CaseConformity {
  const { link } = material
  if (link === null) return { judged: false, reason: material.reason }
  const basis = {
    rule: material.rule === 'guard_band' ? ('guard' as const) : ('simple' as const),
    uncertainty: uncertaintyOf(options),
    edition: link.summary.edition,
  }
  return {
    judged: true,
    link: link.summary,
    conformity: evaluateConformity(result, link.record, basis),
  }
}

const WORST_FIRST: readonly OverallVerdict[] = ['fail', 'inconclusive', 'incomplete', 'pass']

/** The case's verdict: the worst of its records' (any fail fails the case). */
export function overallOf(
  judged: readonly CaseConformity[],
  material: CaseMaterial,
): CaseOverallConformity {
  const { link } = material
  if (link === null) return { judged: false, reason: material.reason }
  const results = judged.flatMap((item) => (item.judged ? [item.conformity] : []))
  const overall = WORST_FIRST.find((v) => results.some((r) => r.overall === v)) ?? null
  return {
    judged: true,
    link: link.summary,
    overall,
    rule: results[0]?.rule ?? null,
    caution: VERDICT_CAUTION,
  }
}
