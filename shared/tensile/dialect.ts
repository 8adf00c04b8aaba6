import Papa from 'papaparse'
import { TensileInputError } from './errors'
import { isNumericLike } from './number-text'
import type { DecimalSeparator, Delimiter } from './types'

export interface Dialect {
  delimiter: Delimiter
  decimal: DecimalSeparator
}

/*
 * Tab and semicolon come first: a decimal comma is only possible when the comma is not the
 * separator, and testing machines that write decimal commas use one of those two
 * (common practice).
 */
const DELIMITER_PREFERENCE: readonly Delimiter[] = ['\t', ';', ',', '|']
const SAMPLE_LINES = 20
const COMMA_DECIMAL = /^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$/
const POINT_DECIMAL = /^[+-]?\d*\.\d+(?:[eE][+-]?\d+)?$/

/** Non-empty lines from the later part of the head, where the numeric body is. */
function sampleBodyLines(lines: readonly string[]): string[] {
  const sample: string[] = []
  const start = Math.floor(lines.length * 0.6)
  for (let i = start; i < lines.length && sample.length < SAMPLE_LINES; i++) {
    const line = lines[i]
    if (line !== undefined && line.trim() !== '') sample.push(line)
  }
  return sample
}

function parseSample(sample: readonly string[], delimiter: Delimiter): string[][] {
  return Papa.parse<string[]>(sample.join('\n'), { delimiter, skipEmptyLines: true }).data
}

/** Papa Parse splits the sample with each candidate; the first that splits it evenly wins. */
function detectDelimiter(sample: readonly string[]): Delimiter {
  for (const delimiter of DELIMITER_PREFERENCE) {
    const rows = parseSample(sample, delimiter)
    const width = rows[0]?.length ?? 0
    if (width >= 2 && rows.every((row) => row.length === width)) return delimiter
  }
  const numericLines = sample.filter((line) => isNumericLike(line, '.') || isNumericLike(line, ','))
  if (numericLines.length === 0) throw new TensileInputError('No numeric data found in the file')
  throw new TensileInputError(
    'Only one column found: a record needs force and extension (or stress and strain) columns',
  )
}

function detectDecimal(sample: readonly string[], delimiter: Delimiter): DecimalSeparator {
  let commaCells = 0
  let pointCells = 0
  for (const row of parseSample(sample, delimiter)) {
    for (const cell of row) {
      const text = cell.trim()
      if (COMMA_DECIMAL.test(text)) commaCells++
      else if (POINT_DECIMAL.test(text)) pointCells++
    }
  }
  return commaCells > pointCells ? ',' : '.'
}

/** Works out the separator and decimal mark of a delimited record; overrides win. */
export function detectDialect(
  lines: readonly string[],
  overrides: { delimiter?: Delimiter; decimal?: DecimalSeparator },
): Dialect {
  const sample = sampleBodyLines(lines)
  const delimiter = overrides.delimiter ?? detectDelimiter(sample)
  const decimal = overrides.decimal ?? detectDecimal(sample, delimiter)
  return { delimiter, decimal }
}
