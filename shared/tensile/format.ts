import type { PropertyQuantity } from './properties'
import { roundToIncrement, ISO_6892_ROUNDING } from './rounding'
import { MPA_PER_KSI, MPA_PER_PSI } from './units'

export type UnitSystem = 'si' | 'us'

/** How a quantity is reported: unit, divisor from the engine's unit, increment and decimals. */
interface Presentation {
  unit: string
  divisor: number
  /** Reporting increment; null means three significant digits. */
  increment: number | null
  decimals: number
}

const r = ISO_6892_ROUNDING
const percent = (increment: number, decimals: number): Presentation => ({
  unit: '%',
  divisor: 1,
  increment,
  decimals,
})
const plain = (increment: number, decimals: number): Presentation => ({
  unit: '',
  divisor: 1,
  increment,
  decimals,
})

/*
 * SI follows ISO 6892-1 (rounding.ts). US customary increments are common practice: 0.1 ksi,
 * 0.1 Msi, 1 in·lbf/in³ (= 1 psi). The exponent n to 0.001 and energies to three significant
 * digits are our own choice.
 */
const PRESENTATIONS: Readonly<Record<PropertyQuantity, Record<UnitSystem, Presentation>>> = {
  strength: {
    si: { unit: 'MPa', divisor: 1, increment: r.strengthMPa, decimals: 0 },
    us: { unit: 'ksi', divisor: MPA_PER_KSI, increment: 0.1, decimals: 1 },
  },
  modulus: {
    si: { unit: 'GPa', divisor: 1, increment: r.modulusGPa, decimals: 0 },
    us: { unit: 'Msi', divisor: MPA_PER_KSI, increment: 0.1, decimals: 1 },
  },
  elongation: { si: percent(r.elongationPct, 1), us: percent(r.elongationPct, 1) },
  yieldPointElongation: {
    si: percent(r.yieldPointElongationPct, 1),
    us: percent(r.yieldPointElongationPct, 1),
  },
  reduction: { si: percent(r.reductionOfAreaPct, 0), us: percent(r.reductionOfAreaPct, 0) },
  exponent: { si: plain(0.001, 3), us: plain(0.001, 3) },
  energy: {
    si: { unit: 'MJ/m³', divisor: 1, increment: null, decimals: 0 },
    us: { unit: 'in·lbf/in³', divisor: MPA_PER_PSI, increment: 1, decimals: 0 },
  },
  count: { si: plain(1, 0), us: plain(1, 0) },
}

/** The unit a quantity is reported in. */
export function reportUnit(quantity: PropertyQuantity, units: UnitSystem): string {
  return PRESENTATIONS[quantity][units].unit
}

function rounded(value: number, p: Presentation, finer: boolean): string {
  const shown = value / p.divisor
  if (p.increment === null) return shown.toPrecision(finer ? 2 : 3)
  const increment = finer ? p.increment / 10 : p.increment
  return roundToIncrement(shown, increment).toFixed(p.decimals + (finer ? 1 : 0))
}

/** A value (in the engine's unit) as a report shows it: converted, rounded, with its unit. */
export function formatValue(value: number | null, quantity: PropertyQuantity, units: UnitSystem) {
  if (value === null) return '—'
  const p = PRESENTATIONS[quantity][units]
  return `${rounded(value, p, false)} ${p.unit}`.trim()
}

/** A standard deviation: one digit finer than the value it describes (common practice). */
export function formatSpread(value: number | null, quantity: PropertyQuantity, units: UnitSystem) {
  if (value === null) return '—'
  const p = PRESENTATIONS[quantity][units]
  return `${rounded(value, p, true)} ${p.unit}`.trim()
}
