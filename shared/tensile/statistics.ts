import type { TensileResult } from './result'

export interface PropertySummary {
  count: number
  mean: number
  standardDeviation: number | null
  min: number
  max: number
}

/** The single-valued properties worth summarising over a set of specimens. */
export const SUMMARISED_PROPERTIES = [
  'modulusGPa',
  'yieldStrengthMPa',
  'rt05MPa',
  'upperYieldMPa',
  'lowerYieldMPa',
  'tensileStrengthMPa',
  'uniformElongationPct',
  'totalElongationAtMaxForcePct',
  'elongationAfterFracturePct',
  'elongationAfterFractureFromLuPct',
  'reductionOfAreaPct',
  'strainHardeningExponent',
  'strengthCoefficientMPa',
  'toughnessMJm3',
] as const satisfies readonly (keyof TensileResult)[]

type Summarised = (typeof SUMMARISED_PROPERTIES)[number]

/** Mean, sample standard deviation (n − 1), min and max of the values that exist. */
export function summariseValues(values: readonly number[]): PropertySummary | null {
  if (values.length === 0) return null
  const mean = values.reduce((sum, v) => sum + v, 0) / values.length
  const squares = values.reduce((sum, v) => sum + (v - mean) ** 2, 0)
  return {
    count: values.length,
    mean,
    standardDeviation: values.length > 1 ? Math.sqrt(squares / (values.length - 1)) : null,
    min: Math.min(...values),
    max: Math.max(...values),
  }
}

/** Per-property statistics over several specimens; properties nobody reached are left out. */
export function summariseSpecimens(
  results: readonly TensileResult[],
): Partial<Record<Summarised, PropertySummary>> {
  const summary: Partial<Record<Summarised, PropertySummary>> = {}
  for (const key of SUMMARISED_PROPERTIES) {
    const values = results.map((r) => r[key]).filter((v): v is number => typeof v === 'number')
    const stats = summariseValues(values)
    if (stats !== null) summary[key] = stats
  }
  return summary
}
