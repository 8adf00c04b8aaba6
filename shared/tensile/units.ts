import { withoutBrackets } from './brackets'
import { TensileInputError } from './errors'
import { quoted } from './printable'

/*
 * Exact unit definitions (NIST SP 811, appendix B): the inch is 25.4 mm by definition, the
 * pound-force is the pound mass (0.45359237 kg) times standard gravity (9.80665 m/s²), and the
 * kilogram-force is 1 kg times standard gravity. Every factor converts to the engine's internal
 * units: N, mm, MPa (= N/mm²), strain as a fraction.
 */
export const MM_PER_INCH = 25.4
export const NEWTON_PER_LBF = 4.4482216152605
export const NEWTON_PER_KGF = 9.80665
export const MPA_PER_PSI = NEWTON_PER_LBF / (MM_PER_INCH * MM_PER_INCH)
export const MPA_PER_KSI = MPA_PER_PSI * 1000

export type Quantity = 'force' | 'length' | 'area' | 'strain' | 'stress' | 'time'

type UnitTable = Readonly<Record<string, number>>

const FORCE_UNITS: UnitTable = {
  n: 1,
  kn: 1000,
  dan: 10,
  lbf: NEWTON_PER_LBF,
  lb: NEWTON_PER_LBF,
  kip: NEWTON_PER_LBF * 1000,
  kgf: NEWTON_PER_KGF,
}

const LENGTH_UNITS: UnitTable = { mm: 1, µm: 0.001, um: 0.001, cm: 10, m: 1000, in: MM_PER_INCH }

const AREA_UNITS: UnitTable = {
  mm2: 1,
  'mm²': 1,
  cm2: 100,
  'cm²': 100,
  in2: MM_PER_INCH * MM_PER_INCH,
  'in²': MM_PER_INCH * MM_PER_INCH,
}

const STRAIN_UNITS: UnitTable = {
  '': 1,
  '-': 1,
  '–': 1,
  '1': 1,
  'mm/mm': 1,
  'in/in': 1,
  'm/m': 1,
  '%': 0.01,
}

const STRESS_UNITS: UnitTable = {
  mpa: 1,
  'n/mm2': 1,
  'n/mm²': 1,
  gpa: 1000,
  kpa: 0.001,
  pa: 1e-6,
  psi: MPA_PER_PSI,
  ksi: MPA_PER_KSI,
}

const TIME_UNITS: UnitTable = { s: 1, sec: 1, ms: 0.001, min: 60, h: 3600 }

const TABLES: Readonly<Record<Quantity, UnitTable>> = {
  force: FORCE_UNITS,
  length: LENGTH_UNITS,
  area: AREA_UNITS,
  strain: STRAIN_UNITS,
  stress: STRESS_UNITS,
  time: TIME_UNITS,
}

function unitKey(unit: string, quantity: Quantity): string {
  const trimmed = withoutBrackets(unit.trim()).trim()
  // Case matters only where SI prefixes would clash (mm vs Mm); none of ours do except m vs M.
  return quantity === 'length' ? trimmed : trimmed.toLowerCase()
}

/** Factor that converts a value in `unit` to the engine's unit for `quantity`, or null. */
export function unitFactor(unit: string, quantity: Quantity): number | null {
  return TABLES[quantity][unitKey(unit, quantity)] ?? null
}

/** True when `unit` names any unit the engine knows (used to recognise a units row). */
export function isKnownUnit(unit: string): boolean {
  return (Object.keys(TABLES) as Quantity[]).some((q) => unitFactor(unit, q) !== null)
}

/** Like unitFactor, but a missing unit is an input error that names the column. */
export function requireUnitFactor(unit: string, quantity: Quantity, columnName: string): number {
  const factor = unitFactor(unit, quantity)
  if (factor === null) {
    const shown = unit.trim() === '' ? 'no unit' : `unit ${quoted(unit.trim())}`
    throw new TensileInputError(
      `Column ${quoted(columnName)}: ${shown} is not recognised as a ${quantity} unit`,
    )
  }
  return factor
}
