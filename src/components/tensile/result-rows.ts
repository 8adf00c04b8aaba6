import {
  formatValue,
  PROPERTY_CATALOGUE,
  propertyLabel,
  type ConformityResult,
  type SpecimenResult,
  type UnitSystem,
  type Verdict,
} from '../../../shared/tensile'

export interface PropertyRow {
  key: string
  label: string
  value: string
}

/** The per-specimen table from the engine's catalogue: labels, units and rounding all from it. */
export function propertyRows(result: SpecimenResult, units: UnitSystem): PropertyRow[] {
  const rows: PropertyRow[] = []
  for (const entry of PROPERTY_CATALOGUE.filter((p) => p.inTable)) {
    if (entry.key === 'yieldStrengthsMPa') {
      for (const [offset, value] of Object.entries(result.yieldStrengthsMPa))
        rows.push({
          key: `Rp${offset}`,
          label: propertyLabel(entry, offset),
          value: formatValue(value, 'strength', units),
        })
      continue
    }
    const value = result[entry.key]
    rows.push({
      key: entry.key,
      label: propertyLabel(entry),
      value: formatValue(typeof value === 'number' ? value : null, entry.quantity, units),
    })
  }
  return rows
}

/** Each verdict in words and with its own icon, so it never rests on colour alone. */
export const VERDICT_LOOK: Record<
  Verdict | ConformityResult['overall'],
  { icon: string; words: string }
> = {
  pass: { icon: '✔', words: 'Pass' },
  fail: { icon: '✖', words: 'Fail' },
  inconclusive: { icon: '?', words: 'Inconclusive' },
  incomplete: { icon: '…', words: 'Incomplete' },
  'not comparable': { icon: '≠', words: 'Not comparable' },
  'not measured': { icon: '–', words: 'Not measured' },
}
