import { parseArgs } from 'node:util'
import {
  parseQuantity,
  quantityUnit,
  TensileInputError,
  unitFactor,
  findSpecification,
  type AnalysisOptions,
  type ColumnRole,
  type DecisionRule,
  type SpecificationRecord,
  type DecimalSeparator,
  type Delimiter,
  type FitRange,
  type GeometryInput,
  type ImportOptions,
  type SectionInput,
} from '../../shared/tensile'

/** Everything the command line was asked to do. */
export interface CommandLine {
  files: string[]
  json: boolean
  units: 'si' | 'us'
  analysis: ImportOptions & AnalysisOptions
  specification: SpecificationRecord | null
  rule: DecisionRule
}

const ROLES: readonly ColumnRole[] = ['force', 'extension', 'strain', 'stress', 'time']

const GEOMETRY_FLAGS = [
  'diameter',
  'width',
  'thickness',
  'outer-diameter',
  'wall',
  'area',
  'gauge-length',
  'original-gauge-length',
  'final-gauge-length',
  'final-diameter',
  'final-width',
  'final-thickness',
  'final-area',
] as const

const OPTION_SPEC = {
  json: { type: 'boolean' },
  help: { type: 'boolean' },
  units: { type: 'string' },
  offset: { type: 'string' },
  'fit-range': { type: 'string' },
  'hardening-range': { type: 'string' },
  spec: { type: 'string' },
  rule: { type: 'string' },
  uncertainty: { type: 'string' },
  delimiter: { type: 'string' },
  decimal: { type: 'string' },
  ...Object.fromEntries(GEOMETRY_FLAGS.map((flag) => [flag, { type: 'string' }])),
  ...Object.fromEntries(
    ROLES.flatMap((r) => [
      [`${r}-column`, { type: 'string' }],
      [`${r}-unit`, { type: 'string' }],
    ]),
  ),
} as const

type Values = Record<string, string | boolean | undefined>

export const USAGE =
  'usage: npm run -s analyze -- FILE... [--diameter 12.5mm | --width W --thickness T | ' +
  '--outer-diameter D --wall T | --area S0] [--gauge-length Le] [--offset 0.2[,1]] ' +
  '[--spec NAME|list] [--rule simple|guard] [--uncertainty 5MPa,0.5%] [--json] [--units si|us]'

const DELIMITERS: Readonly<Record<string, Delimiter>> = {
  comma: ',',
  ',': ',',
  semicolon: ';',
  ';': ';',
  tab: '\t',
  '\\t': '\t',
  '\t': '\t',
  pipe: '|',
  '|': '|',
}
const DECIMALS: Readonly<Record<string, DecimalSeparator>> = {
  point: '.',
  '.': '.',
  comma: ',',
  ',': ',',
}

function text(values: Values, name: string): string | undefined {
  const value = values[name]
  return typeof value === 'string' ? value : undefined
}

function length(values: Values, name: string): number | undefined {
  const value = text(values, name)
  return value === undefined ? undefined : parseQuantity(value, 'length', 'mm')
}

function section(values: Values, prefix: '' | 'final-'): SectionInput {
  const area = text(values, `${prefix}area`)
  return {
    diameterMm: length(values, `${prefix}diameter`),
    widthMm: length(values, `${prefix}width`),
    thicknessMm: length(values, `${prefix}thickness`),
    outerDiameterMm: prefix === '' ? length(values, 'outer-diameter') : undefined,
    wallMm: prefix === '' ? length(values, 'wall') : undefined,
    areaMm2: area === undefined ? undefined : parseQuantity(area, 'area', 'mm2'),
  }
}

function geometry(values: Values): GeometryInput {
  return {
    section: section(values, ''),
    finalSection: section(values, 'final-'),
    extensometerGaugeLengthMm: length(values, 'gauge-length'),
    originalGaugeLengthMm: length(values, 'original-gauge-length'),
    finalGaugeLengthMm: length(values, 'final-gauge-length'),
  }
}

/** "0.2" or "0.2,1": offsets in percent. */
export function parseOffsets(value: string): number[] {
  const offsets = value.split(',').map((part) => Number(part.trim()))
  if (offsets.length === 0 || offsets.some((o) => !Number.isFinite(o) || o <= 0)) {
    throw new TensileInputError(
      `--offset '${value}': give positive percentages such as 0.2 or 0.2,1`,
    )
  }
  return offsets
}

/** "100:400MPa" (stress) or "0.05:0.2%" (strain). */
export function parseFitRange(value: string): FitRange {
  const [fromText = '', toText = ''] = value.split(':')
  const unit = quantityUnit(toText)
  if (unitFactor(unit, 'stress') !== null && unit !== '') {
    return {
      quantity: 'stress',
      fromMPa: parseQuantity(fromText, 'stress', unit),
      toMPa: parseQuantity(toText, 'stress', unit),
    }
  }
  if (unitFactor(unit, 'strain') !== null && unit !== '') {
    return {
      quantity: 'strain',
      from: parseQuantity(fromText, 'strain', unit),
      to: parseQuantity(toText, 'strain', unit),
    }
  }
  throw new TensileInputError(`--fit-range '${value}': write it as 100:400MPa or 0.05:0.2%`)
}

function lookup<T>(
  table: Readonly<Record<string, T>>,
  value: string | undefined,
  flag: string,
): T | undefined {
  if (value === undefined) return undefined
  const found = table[value.toLowerCase()] ?? table[value]
  if (found === undefined)
    throw new TensileInputError(
      `--${flag} '${value}' is not one of ${Object.keys(table).join(', ')}`,
    )
  return found
}

function perRole(values: Values, suffix: string): Partial<Record<ColumnRole, string>> {
  return Object.fromEntries(
    ROLES.map((r) => [r, text(values, `${r}-${suffix}`)]).filter(([, v]) => v !== undefined),
  )
}

/** "2:10%": the engineering-strain range of the strain-hardening fit, in percent. */
export function parseHardeningRange(value: string): { from: number; to: number } {
  const match = /^\s*([\d.]+)\s*:\s*([\d.]+)\s*%?\s*$/.exec(value)
  const from = Number(match?.[1])
  const to = Number(match?.[2])
  if (!match || !(to > from))
    throw new TensileInputError(`--hardening-range '${value}': write it as 2:10%`)
  return { from, to }
}

/** "5MPa", "0.5%" or both, comma-separated: U for strengths and for A and Z. */
export function parseUncertainty(value: string): {
  uncertaintyMPa: number
  uncertaintyPct: number
} {
  const u = { uncertaintyMPa: 0, uncertaintyPct: 0 }
  for (const part of value.split(',')) {
    if (quantityUnit(part) === '%') u.uncertaintyPct = Number(part.replace('%', '').trim())
    else u.uncertaintyMPa = parseQuantity(part, 'stress', 'MPa')
    if (!(u.uncertaintyPct >= 0) || !(u.uncertaintyMPa >= 0)) {
      throw new TensileInputError(`--uncertainty '${value}': write it as 5MPa or 5MPa,0.5%`)
    }
  }
  return u
}

function decisionRule(values: Values): DecisionRule {
  const rule = text(values, 'rule') ?? 'simple'
  const uncertainty = text(values, 'uncertainty')
  if (rule === 'simple') return { kind: 'simple' }
  if (rule !== 'guard') throw new TensileInputError(`--rule '${rule}': use simple or guard`)
  if (uncertainty === undefined)
    throw new TensileInputError('--rule guard needs --uncertainty, e.g. 5MPa,0.5%')
  return { kind: 'guard', ...parseUncertainty(uncertainty) }
}

function specification(values: Values): SpecificationRecord | null {
  const designation = text(values, 'spec')
  if (designation === undefined) return null
  const found = findSpecification(designation)
  if (found === null)
    throw new TensileInputError(
      `--spec '${designation}' is not known; --spec list shows the records`,
    )
  return found
}

function analysisOptions(values: Values): ImportOptions & AnalysisOptions {
  const offset = text(values, 'offset')
  const fitRange = text(values, 'fit-range')
  const hardeningRange = text(values, 'hardening-range')
  return {
    geometry: geometry(values),
    delimiter: lookup(DELIMITERS, text(values, 'delimiter'), 'delimiter'),
    decimal: lookup(DECIMALS, text(values, 'decimal'), 'decimal'),
    columns: perRole(values, 'column'),
    units: perRole(values, 'unit'),
    offsetsPct: offset === undefined ? undefined : parseOffsets(offset),
    fitRange: fitRange === undefined ? undefined : parseFitRange(fitRange),
    hardeningRangePct:
      hardeningRange === undefined ? undefined : parseHardeningRange(hardeningRange),
  }
}

/** Parses argv; every mistake is a TensileInputError with one line for the user. */
export function parseCommandLine(argv: readonly string[]): CommandLine | 'help' | 'list' {
  let parsed: ReturnType<typeof parseArgs>
  try {
    parsed = parseArgs({
      args: [...argv],
      options: OPTION_SPEC,
      allowPositionals: true,
      strict: true,
    })
  } catch (error) {
    throw new TensileInputError(error instanceof Error ? error.message.split('\n')[0]! : USAGE)
  }
  const values = parsed.values as Values
  if (values.help === true) return 'help'
  if (text(values, 'spec') === 'list') return 'list'
  if (parsed.positionals.length === 0) throw new TensileInputError(USAGE)
  const units = text(values, 'units') ?? 'si'
  if (units !== 'si' && units !== 'us')
    throw new TensileInputError(`--units '${units}': use si or us`)
  return {
    files: parsed.positionals,
    json: values.json === true,
    units,
    analysis: analysisOptions(values),
    specification: specification(values),
    rule: decisionRule(values),
  }
}
