import Papa from 'papaparse'
import type { Dialect } from './dialect'
import { TensileInputError } from './errors'
import type { UsedColumn } from './types'

/** A column to read and the factor that converts it to the engine's unit. */
export interface BodyColumn {
  column: UsedColumn
  factor: number
}

const BLANK = /^\s*$/

function cellError(lineIndex: number, column: UsedColumn, cell: string | undefined): Error {
  const shown = cell === undefined ? 'the cell is missing' : `'${cell.trim()}' is not a number`
  return new TensileInputError(`Line ${lineIndex + 1}, column '${column.name}': ${shown}`)
}

/** Number() reads blanks as 0; a blank cell must count as missing. */
function toNumber(cell: string, decimalComma: boolean): number {
  const value = Number(decimalComma ? cell.replace(',', '.') : cell)
  if (!Number.isFinite(value) || (value === 0 && BLANK.test(cell))) return Number.NaN
  return value
}

/** Fills one typed array per column, row by row, checking only the columns in use. */
class ColumnSink {
  readonly values: Float64Array[]
  count = 0
  private lastTime = Number.NEGATIVE_INFINITY
  private readonly timeSlot: number

  constructor(
    private readonly columns: readonly BodyColumn[],
    capacity: number,
    private readonly decimalComma: boolean,
  ) {
    this.values = columns.map(() => new Float64Array(capacity))
    this.timeSlot = columns.findIndex((entry) => entry.column.role === 'time')
  }

  add(cells: readonly string[], lineIndex: number): void {
    for (let slot = 0; slot < this.columns.length; slot++) {
      const { column, factor } = this.columns[slot]!
      const cell = cells[column.position]
      const value = cell === undefined ? Number.NaN : toNumber(cell, this.decimalComma)
      if (Number.isNaN(value)) throw cellError(lineIndex, column, cell)
      this.values[slot]![this.count] = value * factor
    }
    this.checkTime(lineIndex)
    this.count++
  }

  private checkTime(lineIndex: number): void {
    if (this.timeSlot < 0) return
    const time = this.values[this.timeSlot]![this.count]!
    if (time < this.lastTime) {
      throw new TensileInputError(`Line ${lineIndex + 1}: time runs backwards`)
    }
    this.lastTime = time
  }
}

/**
 * Reads the numeric body. Plain bodies take a split-and-convert fast path (Papa Parse costs
 * several times more on a million rows); a body with quoted cells goes through Papa Parse.
 */
export function readBody(
  lines: readonly string[],
  dataStart: number,
  dialect: Dialect,
  columns: readonly BodyColumn[],
): { values: Float64Array[]; count: number } {
  const sink = new ColumnSink(columns, lines.length - dataStart, dialect.decimal === ',')
  const quoted = lines.some((line, index) => index >= dataStart && line.includes('"'))
  if (quoted) readWithPapa(lines, dataStart, dialect, sink)
  else readFast(lines, dataStart, dialect, sink)
  return { values: sink.values.map((array) => array.subarray(0, sink.count)), count: sink.count }
}

function readFast(
  lines: readonly string[],
  start: number,
  dialect: Dialect,
  sink: ColumnSink,
): void {
  for (let index = start; index < lines.length; index++) {
    const line = lines[index]!
    // Only a line that starts with white space can be blank; the regex is skipped otherwise.
    if (line.length === 0 || (line.charCodeAt(0) <= 32 && BLANK.test(line))) continue
    sink.add(line.split(dialect.delimiter), index)
  }
}

function readWithPapa(
  lines: readonly string[],
  start: number,
  dialect: Dialect,
  sink: ColumnSink,
): void {
  const body = lines.slice(start).join('\n')
  const rows = Papa.parse<string[]>(body, { delimiter: dialect.delimiter }).data
  rows.forEach((cells, rowIndex) => {
    if (cells.every((cell) => BLANK.test(cell))) return
    sink.add(cells, start + rowIndex)
  })
}
