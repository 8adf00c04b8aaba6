import {
  ISO_6892_ROUNDING,
  MPA_PER_KSI,
  MPA_PER_PSI,
  roundToIncrement,
  type ConformityResult,
  type PropertySummary,
  type TensileResult,
} from '../../shared/tensile'

type Kind =
  | 'strength'
  | 'modulus'
  | 'elongation'
  | 'yieldPoint'
  | 'reduction'
  | 'exponent'
  | 'energy'
  | 'count'

interface Row {
  label: string
  value: number | null
  kind: Kind
}

/** Strength and modulus rows in SI; converted for `--units us`. */
function rows(result: TensileResult): Row[] {
  return [
    { label: 'Elastic slope E', value: result.modulusGPa, kind: 'modulus' },
    { label: 'Proportional limit', value: result.proportionalLimitMPa, kind: 'strength' },
    ...Object.entries(result.yieldStrengthsMPa).map(([offset, value]): Row => ({
      label: `Offset yield strength Rp${offset}`,
      value,
      kind: 'strength',
    })),
    { label: 'Proof strength Rt0.5', value: result.rt05MPa, kind: 'strength' },
    { label: 'Upper yield strength ReH', value: result.upperYieldMPa, kind: 'strength' },
    { label: 'Lower yield strength ReL', value: result.lowerYieldMPa, kind: 'strength' },
    {
      label: 'Yield-point elongation Ae',
      value: result.yieldPointElongationPct,
      kind: 'yieldPoint',
    },
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
    {
      label: 'Strain-hardening exponent n',
      value: result.strainHardeningExponent,
      kind: 'exponent',
    },
    { label: 'Strength coefficient K', value: result.strengthCoefficientMPa, kind: 'strength' },
    { label: 'Modulus of resilience', value: result.resilienceMJm3, kind: 'energy' },
    { label: 'Toughness', value: result.toughnessMJm3, kind: 'energy' },
    { label: 'Points', value: result.points, kind: 'count' },
  ]
}

const SI_UNITS: Readonly<Record<Kind, string>> = {
  strength: 'MPa',
  modulus: 'GPa',
  elongation: '%',
  yieldPoint: '%',
  reduction: '%',
  exponent: '',
  energy: 'MJ/m³',
  count: '',
}
const US_UNITS: Readonly<Record<Kind, string>> = {
  strength: 'ksi',
  modulus: 'Msi',
  elongation: '%',
  yieldPoint: '%',
  reduction: '%',
  exponent: '',
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
    case 'yieldPoint':
      return roundToIncrement(value, r.yieldPointElongationPct).toFixed(1)
    case 'reduction':
      return roundToIncrement(value, r.reductionOfAreaPct).toFixed(0)
    case 'exponent':
      return value.toFixed(3)
    case 'energy':
      return us ? roundToIncrement(value / MPA_PER_PSI, 1).toFixed(0) : value.toPrecision(3)
    case 'count':
      return String(value)
  }
}

function conformityLines(conformity: ConformityResult | null): string[] {
  if (conformity === null) return []
  const spec = conformity.specification
  const items = conformity.items.map((item) => {
    const value = item.value === null ? '—' : item.value.toFixed(1)
    const note = item.note === undefined ? '' : ` (${item.note})`
    return `    ${item.property} ${item.bound} ${item.limit}: ${value} → ${item.verdict}${note}`
  })
  return [
    `  Conformity with ${spec.standard} ${spec.grade} [${spec.source}]: ${conformity.overall}`,
    `    rule: ${conformity.rule}`,
    ...items,
  ]
}

/** The readable report: one line per property, rounded as ISO 6892-1 reports them. */
export function formatTable(
  result: TensileResult & { file: string; conformity: ConformityResult | null },
  units: 'si' | 'us',
): string {
  const table = units === 'us' ? US_UNITS : SI_UNITS
  const lines = rows(result).map(({ label, value, kind }) => {
    const text = value === null ? '—' : `${shown(value, kind, units)} ${table[kind]}`.trim()
    return `  ${label.padEnd(38)}${text}`
  })
  const warnings = result.warnings.map((warning) => `  warning: ${warning}`)
  return [result.file, ...lines, ...conformityLines(result.conformity), ...warnings].join('\n')
}

/** Statistics over several specimens, full precision to four significant digits. */
export function formatSummary(summary: {
  specimens: number
  properties: Record<string, PropertySummary>
}): string {
  const lines = Object.entries(summary.properties).map(([key, s]) => {
    const sd = s.standardDeviation === null ? '—' : s.standardDeviation.toPrecision(3)
    return `  ${key.padEnd(34)}mean ${s.mean.toPrecision(5)}  sd ${sd}  min ${s.min.toPrecision(5)}  max ${s.max.toPrecision(5)}`
  })
  return [`Summary of ${summary.specimens} specimens`, ...lines].join('\n')
}
