import { MM_PER_INCH, NEWTON_PER_KGF, NEWTON_PER_LBF } from '../../../shared/tensile'
import type { SyntheticCurve } from './curves'

/** How a testing machine might write a record; every field changes the text, not the test. */
export interface RecordFormat {
  delimiter: ',' | ';' | '\t'
  decimal: '.' | ','
  forceUnit: 'N' | 'kN' | 'lbf' | 'kgf'
  lengthUnit: 'mm' | 'in'
  /** Write strain in percent instead of extensometer extension. */
  strainInPercent: boolean
  unitStyle: 'brackets' | 'parentheses' | 'row'
  /** Geometry in a key/value/unit preamble (else the caller passes it as options). */
  preamble: boolean
  /** Order of the columns time, crosshead, extension/strain, force, true stress. */
  order: readonly number[]
}

export const SPECIMEN = { diameterMm: 10, gaugeLengthMm: 50 }
export const SPECIMEN_AREA_MM2 = (Math.PI / 4) * SPECIMEN.diameterMm ** 2

const FORCE_PER_NEWTON: Readonly<Record<RecordFormat['forceUnit'], number>> = {
  N: 1,
  kN: 0.001,
  lbf: 1 / NEWTON_PER_LBF,
  kgf: 1 / NEWTON_PER_KGF,
}

function numberText(value: number, format: RecordFormat): string {
  const text = String(value)
  return format.decimal === ',' ? text.replace('.', ',') : text
}

function lengthIn(mm: number, format: RecordFormat): number {
  return format.lengthUnit === 'in' ? mm / MM_PER_INCH : mm
}

function preambleLines(format: RecordFormat): string[] {
  const d = format.delimiter
  const unit = format.lengthUnit
  return [
    `Specimen${d}synthetic`,
    `Diameter:${d}${numberText(lengthIn(SPECIMEN.diameterMm, format), format)}${d}${unit}`,
    `Extensometer gauge length:${d}${numberText(lengthIn(SPECIMEN.gaugeLengthMm, format), format)}${d}${unit}`,
  ]
}

function columns(format: RecordFormat): [string, string][] {
  const deformation: [string, string] = format.strainInPercent
    ? ['Strain', '%']
    : ['Extensometer extension', format.lengthUnit]
  return [
    ['Time', 's'],
    ['Crosshead displacement', format.lengthUnit],
    deformation,
    ['Force', format.forceUnit],
    ['True stress', 'MPa'],
  ]
}

function headerLines(format: RecordFormat): string[] {
  const ordered = format.order.map((k) => columns(format)[k]!)
  const d = format.delimiter
  if (format.unitStyle === 'row')
    return [ordered.map(([n]) => n).join(d), ordered.map(([, u]) => u).join(d)]
  const [open, close] = format.unitStyle === 'brackets' ? ['[', ']'] : ['(', ')']
  return [ordered.map(([n, u]) => `${n} ${open}${u}${close}`).join(d)]
}

function rowCells(curve: SyntheticCurve, i: number, format: RecordFormat): number[] {
  const strain = curve.strain[i]!
  const stress = curve.stressMPa[i]!
  const deformation = format.strainInPercent
    ? strain * 100
    : lengthIn(strain * SPECIMEN.gaugeLengthMm, format)
  const force = stress * SPECIMEN_AREA_MM2 * FORCE_PER_NEWTON[format.forceUnit]
  return [
    i * 0.1,
    lengthIn(strain * SPECIMEN.gaugeLengthMm * 1.7, format),
    deformation,
    force,
    Number.NaN,
  ]
}

/** Writes a synthetic curve as a delimited text record in the given dialect. */
export function writeRecord(curve: SyntheticCurve, format: RecordFormat): string {
  const body = curve.strain.map((_, i) => {
    const cells = rowCells(curve, i, format)
    return format.order
      .map((k) => (Number.isNaN(cells[k]!) ? 'nan' : numberText(cells[k]!, format)))
      .join(format.delimiter)
  })
  const head = format.preamble ? preambleLines(format) : []
  return [...head, ...headerLines(format), ...body].join('\n') + '\n'
}

export const PLAIN_FORMAT: RecordFormat = {
  delimiter: ',',
  decimal: '.',
  forceUnit: 'N',
  lengthUnit: 'mm',
  strainInPercent: false,
  unitStyle: 'brackets',
  preamble: true,
  order: [0, 1, 2, 3, 4],
}
