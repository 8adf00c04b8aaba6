import { firstBracketed } from './brackets'
import type { Dialect } from './dialect'
import { parseNumberCell } from './number-text'
import type { GeometryInput, SectionInput } from './types'
import { unitFactor } from './units'

type SectionField = keyof SectionInput
type LengthField = 'extensometerGaugeLengthMm' | 'originalGaugeLengthMm' | 'finalGaugeLengthMm'

interface FieldRule {
  pattern: RegExp
  field: SectionField | LengthField
  final: boolean
}

const FINAL = /final|after|fracture|\bdu\b|\bsu\b|\blu\b|\bbu\b|\bau\b/

/* Most specific first: "gauge diameter" is a diameter, "outer diameter" is a tube. */
const FIELD_RULES: readonly FieldRule[] = [
  { pattern: /outer diameter|\bod\b|\bda\b/, field: 'outerDiameterMm', final: false },
  { pattern: /wall/, field: 'wallMm', final: false },
  { pattern: /diameter|\bd0\b|\bdu\b|\bd\b/, field: 'diameterMm', final: false },
  { pattern: /width|\bb0\b|\bbu\b/, field: 'widthMm', final: false },
  { pattern: /thickness|\ba0\b|\bau\b/, field: 'thicknessMm', final: false },
  { pattern: /cross[- ]?section|area|\bs0\b|\bsu\b/, field: 'areaMm2', final: false },
  {
    pattern: /final gauge length|gauge length after|\blu\b/,
    field: 'finalGaugeLengthMm',
    final: true,
  },
  {
    pattern: /original gauge length|marked gauge length|\bl0\b/,
    field: 'originalGaugeLengthMm',
    final: false,
  },
  { pattern: /extensometer|gauge length|\ble\b/, field: 'extensometerGaugeLengthMm', final: false },
]

function keyUnit(key: string, unitCell: string | undefined): string {
  if (unitCell !== undefined && unitCell.trim() !== '') return unitCell.trim()
  return firstBracketed(key) ?? ''
}

/** Converts a preamble value to mm or mm²; a value without a unit is taken in mm (mm²). */
function toEngineUnit(value: number, unit: string, field: string): number | null {
  const quantity = field === 'areaMm2' ? 'area' : 'length'
  const factor = unit === '' ? 1 : unitFactor(unit, quantity)
  return factor === null ? null : value * factor
}

function assign(geometry: GeometryInput, rule: FieldRule, isFinal: boolean, value: number): void {
  if (rule.final || rule.field.endsWith('GaugeLengthMm')) {
    const field = rule.field as LengthField
    geometry[field] ??= value
    return
  }
  const field = rule.field as SectionField
  const section = isFinal ? (geometry.finalSection ??= {}) : (geometry.section ??= {})
  section[field] ??= value
}

/**
 * Reads specimen geometry from preamble lines such as `Gauge diameter:<TAB>5.003<TAB>mm` or
 * `Width (mm);12,5`. Lines it does not recognise (material, lab values, dates) are skipped.
 */
export function readPreambleGeometry(rows: readonly string[][], dialect: Dialect): GeometryInput {
  const geometry: GeometryInput = {}
  for (const [key = '', valueCell = '', unitCell] of rows) {
    const name = key.toLowerCase().replace(/:$/, '').trim()
    const rule = FIELD_RULES.find((candidate) => candidate.pattern.test(name))
    const raw = parseNumberCell(valueCell, dialect.decimal)
    if (rule === undefined || Number.isNaN(raw)) continue
    const value = toEngineUnit(raw, keyUnit(key, unitCell), rule.field)
    if (value !== null) assign(geometry, rule, FINAL.test(name), value)
  }
  return geometry
}
