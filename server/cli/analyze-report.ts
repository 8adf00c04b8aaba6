import {
  closingCaution,
  conformityQuantity,
  formatSpread,
  formatValue,
  PROPERTY_CATALOGUE,
  propertyLabel,
  reportSummary,
  specimenResults,
  type ConformityResult,
  type PropertyEntry,
  type SpecimenResult,
  type TensileReport,
  type UnitSystem,
  withoutControlCharacters,
} from '../../shared/tensile'

/* The readable report, built only from the shared catalogue, formats and cautions. */

const LABEL_WIDTH = 44

function row(label: string, text: string): string {
  return `  ${label.padEnd(LABEL_WIDTH)}${text}`
}

function propertyRows(result: SpecimenResult, units: UnitSystem): string[] {
  return PROPERTY_CATALOGUE.filter((p) => p.inTable).flatMap((property: PropertyEntry) => {
    if (property.key === 'yieldStrengthsMPa')
      return Object.entries(result.yieldStrengthsMPa).map(([offset, value]) =>
        row(propertyLabel(property, offset), formatValue(value, property.quantity, units)),
      )
    const value = result[property.key]
    const shown = typeof value === 'number' || value === null ? value : null
    return [row(propertyLabel(property), formatValue(shown, property.quantity, units))]
  })
}

function conformityLines(conformity: ConformityResult | null, units: UnitSystem): string[] {
  if (conformity === null) return []
  const spec = conformity.specification
  const edition = spec.edition === null ? 'edition not stated' : `edition ${spec.edition}`
  const items = conformity.items.map((item) => {
    const quantity = conformityQuantity(item.property)
    const show = (value: number | null) =>
      quantity === null ? String(value ?? '—') : formatValue(value, quantity, units)
    // U is the lab's own figure: shown one digit finer than the values, not rounded away.
    const u =
      item.uncertainty === null || quantity === null
        ? ''
        : ` (U ${formatSpread(item.uncertainty, quantity, units)})`
    const note = item.note === undefined ? '' : `; ${item.note}`
    const bound = item.bound === 'min' ? '≥' : '≤'
    return `    ${item.property} ${bound} ${show(item.limit)}: ${show(item.value)}${u} → ${item.verdict}${note}`
  })
  return [
    `  Conformity with ${spec.standard} ${spec.grade} (${edition}; ${spec.source}): ${conformity.overall}`,
    `    ${conformity.caution}`,
    `    rule: ${conformity.rule}`,
    ...items,
  ]
}

function fitLine(result: SpecimenResult, units: UnitSystem): string {
  const fit = result.modulusFit
  const range = `${formatValue(fit.fromMPa, 'strength', units)} to ${formatValue(fit.toMPa, 'strength', units)}`
  const how = fit.chosenBy === 'automatic' ? 'automatic window' : 'fit range given'
  const points = `points ${fit.fromPoint} to ${fit.toPoint}`
  return row('Elastic fit', `${range} (${how}, ${points}, R² ${fit.rSquared.toFixed(5)})`)
}

/** One specimen: a line per property, rounded as ISO 6892-1 reports them (or US customary). */
export function formatSpecimen(result: SpecimenResult, units: UnitSystem): string {
  return [
    withoutControlCharacters(result.file),
    ...propertyRows(result, units),
    fitLine(result, units),
    ...conformityLines(result.conformity, units),
    ...result.warnings.map((warning) => `  warning: ${warning}`),
  ].join('\n')
}

function summaryLines(report: TensileReport, units: UnitSystem): string[] {
  const summary = reportSummary(report)
  if (summary === null) return []
  const offset = specimenResults(report)[0]?.offsetPct
  const lines = PROPERTY_CATALOGUE.filter((p) => p.summarised).flatMap((property) => {
    const s = summary.properties[property.key]
    if (s === undefined) return []
    const show = (value: number | null) => formatValue(value, property.quantity, units)
    const sd = formatSpread(s.standardDeviation, property.quantity, units)
    const text = `mean ${show(s.mean)}, sd ${sd}, min ${show(s.min)}, max ${show(s.max)} (${s.count})`
    return [row(propertyLabel(property, offset), text)]
  })
  return [`Summary of ${summary.specimens} specimens`, ...lines]
}

/** The whole readable report: each specimen, the summary of a set, and the closing caution. */
export function formatReport(report: TensileReport, units: UnitSystem): string {
  const results = specimenResults(report)
  const spec = results[0]?.conformity?.specification ?? null
  const summary = summaryLines(report, units)
  return [
    ...results.map((result) => formatSpecimen(result, units)),
    ...(summary.length === 0 ? [] : [summary.join('\n')]),
    closingCaution(spec),
  ].join('\n\n')
}
