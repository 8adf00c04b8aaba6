import {
  ISO_6892_ROUNDING,
  MPA_PER_KSI,
  roundToIncrement,
  type TensileResult,
} from '../../shared/tensile'

type Kind = 'strength' | 'modulus' | 'elongation' | 'reduction' | 'energy' | 'count'

interface Row {
  label: string
  value: number | null
  kind: Kind
}

/** Strength and modulus rows in SI; converted for `--units us`. */
function rows(result: TensileResult): Row[] {
  const rp = `Rp${result.offsetPct}`
  return [
    { label: 'Elastic slope E', value: result.modulusGPa, kind: 'modulus' },
    { label: 'Proportional limit', value: result.proportionalLimitMPa, kind: 'strength' },
    { label: `Offset yield strength ${rp}`, value: result.yieldStrengthMPa, kind: 'strength' },
    { label: 'Tensile strength Rm', value: result.tensileStrengthMPa, kind: 'strength' },
    { label: 'Uniform elongation Ag', value: result.uniformElongationPct, kind: 'elongation' },
    {
      label: 'Total elongation at max. force Agt',
      value: result.totalElongationAtMaxForcePct,
      kind: 'elongation',
    },
    { label: 'Fracture strength', value: result.fractureStrengthMPa, kind: 'strength' },
    {
      label: 'Elongation after fracture A (curve)',
      value: result.elongationAfterFracturePct,
      kind: 'elongation',
    },
    {
      label: 'Elongation after fracture A (Lu)',
      value: result.elongationAfterFractureFromLuPct,
      kind: 'elongation',
    },
    { label: 'Reduction of area Z', value: result.reductionOfAreaPct, kind: 'reduction' },
    { label: 'Modulus of resilience', value: result.resilienceMJm3, kind: 'energy' },
    { label: 'Toughness', value: result.toughnessMJm3, kind: 'energy' },
    { label: 'Points', value: result.points, kind: 'count' },
  ]
}

const SI_UNITS: Readonly<Record<Kind, string>> = {
  strength: 'MPa',
  modulus: 'GPa',
  elongation: '%',
  reduction: '%',
  energy: 'MJ/m³',
  count: '',
}
const US_UNITS: Readonly<Record<Kind, string>> = {
  strength: 'ksi',
  modulus: 'Msi',
  elongation: '%',
  reduction: '%',
  energy: 'in·lbf/in³',
  count: '',
}

/* US customary increments are common practice: 0.1 ksi, 0.1 Msi; 1 in·lbf/in³ (= 1 psi). */
function shown(value: number, kind: Kind, units: 'si' | 'us'): string {
  const r = ISO_6892_ROUNDING
  const us = units === 'us'
  switch (kind) {
    case 'strength':
      return us
        ? roundToIncrement(value / MPA_PER_KSI, 0.1).toFixed(1)
        : roundToIncrement(value, r.strengthMPa).toFixed(0)
    case 'modulus':
      return us
        ? roundToIncrement(value / MPA_PER_KSI, 0.1).toFixed(1)
        : roundToIncrement(value, r.modulusGPa).toFixed(0)
    case 'elongation':
      return roundToIncrement(value, r.elongationPct).toFixed(1)
    case 'reduction':
      return roundToIncrement(value, r.reductionOfAreaPct).toFixed(0)
    case 'energy':
      return us
        ? roundToIncrement(((value * 1e6) / (MPA_PER_KSI * 1000) / 1e6) * 1e6, 1).toFixed(0)
        : value.toPrecision(3)
    case 'count':
      return String(value)
  }
}

/** The readable report: one line per property, rounded as ISO 6892-1 reports them. */
export function formatTable(result: TensileResult, units: 'si' | 'us', title: string): string {
  const table = units === 'us' ? US_UNITS : SI_UNITS
  const lines = rows(result).map(({ label, value, kind }) => {
    const text = value === null ? '—' : `${shown(value, kind, units)} ${table[kind]}`.trim()
    return `  ${label.padEnd(38)}${text}`
  })
  const warnings = result.warnings.map((warning) => `  warning: ${warning}`)
  return [title, ...lines, ...warnings].join('\n')
}
