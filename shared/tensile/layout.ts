import Papa from 'papaparse'
import { TensileInputError } from './errors'
import { isNumericLike } from './number-text'
import type { Dialect } from './dialect'
import { isKnownUnit } from './units'

/** Where the parts of a record sit: preamble rows, header, optional units row, first data line. */
export interface RecordLayout {
  preamble: string[][]
  header: string[] | null
  unitsRow: string[] | null
  /** 0-based index of the first data line in the file's lines. */
  dataStart: number
  width: number
}

const HEAD_SCAN_LIMIT = 5000
const CONFIRMING_ROWS = 3

function splitRow(line: string, dialect: Dialect): string[] {
  const row = Papa.parse<string[]>(line, { delimiter: dialect.delimiter }).data[0] ?? []
  return row.map((cell) => cell.trim())
}

/** Mostly numbers, at least two: a text cell in an unused column must not hide the data. */
function isDataRow(row: readonly string[], dialect: Dialect): boolean {
  const filled = row.filter((cell) => cell !== '')
  const numeric = filled.filter((cell) => isNumericLike(cell, dialect.decimal)).length
  return numeric >= 2 && numeric * 2 >= filled.length
}

function isUnitsRow(row: readonly string[]): boolean {
  const bare = row.map((cell) => cell.replace(/^[[(]|[\])]$/g, ''))
  return bare.every((cell) => cell === '' || isKnownUnit(cell)) && bare.some((cell) => cell !== '')
}

/** Index of the first line that starts a run of numeric rows of the body's width. */
function findDataStart(rows: readonly (string[] | null)[], dialect: Dialect): number {
  const isData = (row: string[] | null | undefined): boolean =>
    row !== null && row !== undefined && isDataRow(row, dialect)
  for (let i = 0; i < rows.length; i++) {
    if (!isData(rows[i])) continue
    const following = rows.slice(i).filter((row) => row !== null)
    if (following.slice(0, CONFIRMING_ROWS).every(isData)) return i
  }
  throw new TensileInputError('No numeric data found in the file')
}

/** The nearest non-empty line above `index`, or -1. */
function previousFilled(rows: readonly (string[] | null)[], index: number): number {
  for (let i = index - 1; i >= 0; i--) if (rows[i] !== null) return i
  return -1
}

/**
 * Finds the preamble, the header naming the columns and a units row under it. A row of unit
 * symbols (or empty cells, meaning dimensionless) directly above the data is a units row only
 * when another row sits above it to name the columns.
 */
export function locateLayout(lines: readonly string[], dialect: Dialect): RecordLayout {
  const head = lines.slice(0, HEAD_SCAN_LIMIT)
  const rows = head.map((line) => (line.trim() === '' ? null : splitRow(line, dialect)))
  const dataStart = findDataStart(rows, dialect)
  const width = rows[dataStart]?.length ?? 0
  const above = previousFilled(rows, dataStart)
  const aboveRow = rows[above] ?? null
  if (aboveRow === null || aboveRow.every((cell) => isNumericLike(cell, dialect.decimal))) {
    return { preamble: [], header: null, unitsRow: null, dataStart, width }
  }
  const twoAbove = previousFilled(rows, above)
  const twoAboveRow = rows[twoAbove] ?? null
  const hasUnitsRow = isUnitsRow(aboveRow) && twoAboveRow !== null && twoAboveRow.length >= 2
  const headerIndex = hasUnitsRow ? twoAbove : above
  const preamble = rows.slice(0, headerIndex).filter((row): row is string[] => row !== null)
  return {
    preamble,
    header: rows[headerIndex] ?? null,
    unitsRow: hasUnitsRow ? aboveRow : null,
    dataStart,
    width,
  }
}
