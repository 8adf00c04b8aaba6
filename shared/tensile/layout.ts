import Papa from 'papaparse'
import { withoutBrackets } from './brackets'
import { TensileInputError } from './errors'
import { groupedNumber, RECORD_LIMITS } from './limits'
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

const CONFIRMING_ROWS = 3

/**
 * The head of a file, split into cells by Papa Parse on first use, so that only the preamble,
 * the header and a few data lines are ever parsed here; null for a blank line. A row with too
 * many cells or too long a cell is refused here, before anything else reads it.
 */
class HeadRows {
  private readonly cache = new Map<number, string[] | null>()
  readonly length: number

  constructor(
    private readonly lines: readonly string[],
    private readonly dialect: Dialect,
  ) {
    this.length = lines.length
  }

  at(index: number): string[] | null {
    if (index < 0 || index >= this.length) return null
    if (!this.cache.has(index)) this.cache.set(index, this.split(this.lines[index] ?? '', index))
    return this.cache.get(index) ?? null
  }

  private split(line: string, index: number): string[] | null {
    if (line.trim() === '') return null
    const row = Papa.parse<string[]>(line, { delimiter: this.dialect.delimiter }).data[0] ?? []
    if (row.length > RECORD_LIMITS.columns)
      throw new TensileInputError(
        `Line ${index + 1} has more than ${groupedNumber(RECORD_LIMITS.columns)} columns`,
      )
    const long = row.findIndex((cell) => cell.length > RECORD_LIMITS.cellCharacters)
    if (long >= 0)
      throw new TensileInputError(
        `Line ${index + 1}, column ${long + 1}: a cell longer than ${groupedNumber(RECORD_LIMITS.cellCharacters)} characters`,
      )
    return row.map((cell) => cell.trim())
  }
}

/** Mostly numbers, at least two: a text cell in an unused column must not hide the data. */
function isDataRow(row: readonly string[] | null, dialect: Dialect): boolean {
  if (row === null) return false
  const filled = row.filter((cell) => cell !== '')
  const numeric = filled.filter((cell) => isNumericLike(cell, dialect.decimal)).length
  return numeric >= 2 && numeric * 2 >= filled.length
}

function isUnitsRow(row: readonly string[]): boolean {
  const bare = row.map(withoutBrackets)
  return bare.every((cell) => cell === '' || isKnownUnit(cell)) && bare.some((cell) => cell !== '')
}

/** Index of the first line that starts a run of numeric rows. */
function findDataStart(rows: HeadRows, dialect: Dialect, whole: boolean): number {
  for (let i = 0; i < rows.length; i++) {
    if (!isDataRow(rows.at(i), dialect)) continue
    let confirmed = 0
    let k = i
    for (; k < rows.length && confirmed < CONFIRMING_ROWS; k++) {
      const row = rows.at(k)
      if (row === null) continue
      if (!isDataRow(row, dialect)) break
      confirmed++
    }
    if (confirmed === CONFIRMING_ROWS || k === rows.length) return i
  }
  if (whole) throw new TensileInputError('No numeric data found in the file')
  throw new TensileInputError(
    `No numeric data found in the first ${groupedNumber(rows.length)} lines of the file`,
  )
}

/** The nearest non-empty line above `index`, or -1. */
function previousFilled(rows: HeadRows, index: number): number {
  for (let i = index - 1; i >= 0; i--) if (rows.at(i) !== null) return i
  return -1
}

function preambleRows(rows: HeadRows, end: number): string[][] {
  const preamble: string[][] = []
  for (let i = 0; i < end; i++) {
    const row = rows.at(i)
    if (row !== null) preamble.push(row)
  }
  return preamble
}

/**
 * Finds the preamble, the header naming the columns and a units row under it. A row of unit
 * symbols (or empty cells, meaning dimensionless) directly above the data is a units row only
 * when another row sits above it to name the columns.
 */
export function locateLayout(
  lines: readonly string[],
  dialect: Dialect,
  whole: boolean,
): RecordLayout {
  const rows = new HeadRows(lines, dialect)
  const dataStart = findDataStart(rows, dialect, whole)
  const width = rows.at(dataStart)?.length ?? 0
  const above = previousFilled(rows, dataStart)
  const aboveRow = rows.at(above)
  if (aboveRow === null || aboveRow.every((cell) => isNumericLike(cell, dialect.decimal))) {
    return { preamble: [], header: null, unitsRow: null, dataStart, width }
  }
  const twoAbove = previousFilled(rows, above)
  const twoAboveRow = rows.at(twoAbove)
  const hasUnitsRow = isUnitsRow(aboveRow) && twoAboveRow !== null && twoAboveRow.length >= 2
  const headerIndex = hasUnitsRow ? twoAbove : above
  return {
    preamble: preambleRows(rows, headerIndex),
    header: rows.at(headerIndex),
    unitsRow: hasUnitsRow ? aboveRow : null,
    dataStart,
    width,
  }
}
