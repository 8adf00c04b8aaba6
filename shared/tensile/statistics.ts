import { PROPERTY_CATALOGUE } from './properties'
import type { TensileResult } from './result'

export interface PropertySummary {
  count: number
  mean: number
  standardDeviation: number | null
  min: number
  max: number
}

/** The properties the catalogue marks as summarised, in report order. */
export const SUMMARISED_PROPERTIES = PROPERTY_CATALOGUE.filter((p) => p.summarised).map(
  (p) => p.key,
)

export type SpecimenSummary = Partial<Record<keyof TensileResult, PropertySummary>>

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
export function summariseSpecimens(results: readonly TensileResult[]): SpecimenSummary {
  const summary: SpecimenSummary = {}
  for (const key of SUMMARISED_PROPERTIES) {
    const values = results.map((r) => r[key]).filter((v): v is number => typeof v === 'number')
    const stats = summariseValues(values)
    if (stats !== null) summary[key] = stats
  }
  return summary
}
