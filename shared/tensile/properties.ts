import type { TensileResult } from './result'

/** What a property measures, which decides its unit and its reporting increment (format.ts). */
export type PropertyQuantity =
  | 'strength'
  | 'modulus'
  | 'elongation'
  | 'yieldPointElongation'
  | 'reduction'
  | 'exponent'
  | 'energy'
  | 'count'

export interface PropertyEntry {
  /** The result's JSON key. */
  key: keyof TensileResult
  /** The trade's symbol (ISO 6892-1, ASTM E646), or null where there is none. */
  symbol: string | null
  label: string
  /** Tells apart two ways of measuring one property, e.g. A from the curve or from Lu. */
  qualifier?: string
  quantity: PropertyQuantity
  /** Shown as a row of the per-specimen table. */
  inTable: boolean
  /** Summarised (mean, standard deviation, min, max) over a set of specimens. */
  summarised: boolean
}

/**
 * The one catalogue of tensile properties, in report order. The command line, the web page and
 * the written report all label, round and summarise from it. `yieldStrengthsMPa` stands for one
 * row per offset (Rp0.2, Rp1 …); `yieldStrengthMPa`, the first offset, is what a summary holds.
 */
export const PROPERTY_CATALOGUE: readonly PropertyEntry[] = [
  entry('modulusGPa', 'E', 'Elastic slope', 'modulus', 'both'),
  entry('proportionalLimitMPa', null, 'Proportional limit', 'strength', 'table'),
  entry('yieldStrengthsMPa', 'Rp', 'Offset yield strength', 'strength', 'table'),
  entry('yieldStrengthMPa', 'Rp', 'Offset yield strength', 'strength', 'summary'),
  entry('rt05MPa', 'Rt0.5', 'Proof strength, total extension', 'strength', 'both'),
  entry('upperYieldMPa', 'ReH', 'Upper yield strength', 'strength', 'both'),
  entry('lowerYieldMPa', 'ReL', 'Lower yield strength', 'strength', 'both'),
  entry('yieldPointElongationPct', 'Ae', 'Yield-point elongation', 'yieldPointElongation', 'table'),
  entry('tensileStrengthMPa', 'Rm', 'Tensile strength', 'strength', 'both'),
  entry('uniformElongationPct', 'Ag', 'Uniform elongation', 'elongation', 'both'),
  entry(
    'totalElongationAtMaxForcePct',
    'Agt',
    'Total elongation at maximum force',
    'elongation',
    'both',
  ),
  entry('fractureStrengthMPa', null, 'Fracture strength', 'strength', 'table'),
  {
    ...entry('elongationAfterFracturePct', 'A', 'Elongation after fracture', 'elongation', 'both'),
    qualifier: 'curve',
  },
  {
    ...entry(
      'elongationAfterFractureFromLuPct',
      'A',
      'Elongation after fracture',
      'elongation',
      'both',
    ),
    qualifier: 'Lu',
  },
  entry('reductionOfAreaPct', 'Z', 'Reduction of area', 'reduction', 'both'),
  entry('strainHardeningExponent', 'n', 'Strain-hardening exponent', 'exponent', 'both'),
  entry('strengthCoefficientMPa', 'K', 'Strength coefficient', 'strength', 'both'),
  entry('resilienceMJm3', null, 'Modulus of resilience', 'energy', 'table'),
  // Named in full so nobody reads it as impact toughness or fracture toughness.
  entry('toughnessMJm3', null, 'Tensile toughness (energy to fracture)', 'energy', 'both'),
  entry('points', null, 'Points', 'count', 'table'),
]

function entry(
  key: keyof TensileResult,
  symbol: string | null,
  label: string,
  quantity: PropertyQuantity,
  shown: 'table' | 'summary' | 'both',
): PropertyEntry {
  return {
    key,
    symbol,
    label,
    quantity,
    inTable: shown !== 'summary',
    summarised: shown !== 'table',
  }
}

/** "Tensile strength Rm", "Offset yield strength Rp0.2", "Elongation after fracture A (Lu)". */
export function propertyLabel(property: PropertyEntry, offsetPct?: number | string): string {
  const symbol =
    property.symbol === null
      ? ''
      : ` ${property.symbol}${property.symbol === 'Rp' ? (offsetPct ?? '') : ''}`
  const qualifier = property.qualifier === undefined ? '' : ` (${property.qualifier})`
  return `${property.label}${symbol}${qualifier}`
}

/** The catalogue entry of a result key; throws for a key that is not in it (a programming error). */
export function propertyEntry(key: keyof TensileResult): PropertyEntry {
  const found = PROPERTY_CATALOGUE.find((property) => property.key === key)
  if (found === undefined) throw new Error(`No catalogue entry for ${key}`)
  return found
}
