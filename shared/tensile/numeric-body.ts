import Papa from 'papaparse'
import { ColumnStore } from './column-store'
import type { Dialect } from './dialect'
import { TensileInputError } from './errors'
import { groupedNumber, RECORD_LIMITS } from './limits'
import { quoted } from './printable'
import type { UsedColumn } from './types'

/** A column to read and the factor that converts it to the engine's unit. */
export interface BodyColumn {
  column: UsedColumn
  factor: number
}

function cellError(lineIndex: number, column: UsedColumn, cell: string | undefined): Error {
  const shown =
    cell === undefined ? 'the cell is missing' : `${quoted(cell.trim())} is not a number`
  return new TensileInputError(`Line ${lineIndex + 1}, column ${quoted(column.name)}: ${shown}`)
}

function isBlank(text: string, start: number, end: number): boolean {
  for (let i = start; i < end; i++) if (text.charCodeAt(i) > 32) return false
  return true
}

/** Number() reads blanks as 0; a blank cell must count as missing. */
function toNumber(cell: string, decimalComma: boolean): number {
  const value = Number(decimalComma ? cell.replace(',', '.') : cell)
  if (!Number.isFinite(value) || (value === 0 && isBlank(cell, 0, cell.length))) return Number.NaN
  return value
}

/**
 * Reads the numeric body line by line into one store per column, converting only the cells of
 * the columns in use. Time is checked to run forwards but not kept: no property needs it.
 */
export class BodyReader {
  count = 0
  private readonly stores: ColumnStore[]
  private readonly order: number[]
  private readonly cells: (string | undefined)[]
  private readonly decimalComma: boolean
  private lastTime = Number.NEGATIVE_INFINITY

  constructor(
    private readonly columns: readonly BodyColumn[],
    private readonly dialect: Dialect,
    expectedPoints = 0,
  ) {
    this.stores = columns.map(() => new ColumnStore(expectedPoints))
    this.order = columns.map((_, slot) => slot)
    this.order.sort((a, b) => columns[a]!.column.position - columns[b]!.column.position)
    this.cells = columns.map(() => undefined)
    this.decimalComma = dialect.decimal === ','
  }

  /**
   * One line of the body, as the range start..end of `text`; `quoted` says it holds a double
   * quote, found by the caller in one scan of its text. Blank lines are skipped.
   */
  addLine(text: string, start: number, end: number, lineIndex: number, quoted: boolean): void {
    if (isBlank(text, start, end)) return
    if (quoted) this.splitQuoted(text.slice(start, end))
    else this.splitPlain(text, start, end)
    this.store(lineIndex)
  }

  /** The values of each column, in the order the columns were given. */
  values(): Float64Array[] {
    return this.stores.map((store) => store.toArray(this.count))
  }

  /** Picks the cells in use from a plain line without splitting the rest of it. */
  private splitPlain(text: string, start: number, end: number): void {
    const delimiter = this.dialect.delimiter
    let column = 0
    let cellStart = start
    for (const slot of this.order) {
      const wanted = this.columns[slot]!.column.position
      while (column < wanted && cellStart <= end) {
        const next = text.indexOf(delimiter, cellStart)
        cellStart = next < 0 || next >= end ? end + 1 : next + 1
        column++
      }
      if (cellStart > end) {
        this.cells[slot] = undefined
        continue
      }
      const next = text.indexOf(delimiter, cellStart)
      this.cells[slot] = text.slice(cellStart, next < 0 || next >= end ? end : next)
    }
  }

  /** A line with quoted cells goes through Papa Parse. */
  private splitQuoted(line: string): void {
    const row = Papa.parse<string[]>(line, { delimiter: this.dialect.delimiter }).data[0] ?? []
    this.columns.forEach((entry, slot) => (this.cells[slot] = row[entry.column.position]))
  }

  private store(lineIndex: number): void {
    if (this.count >= RECORD_LIMITS.points)
      throw new TensileInputError(
        `The record holds more than ${groupedNumber(RECORD_LIMITS.points)} data points`,
      )
    for (let slot = 0; slot < this.columns.length; slot++) {
      const { column, factor } = this.columns[slot]!
      const cell = this.cells[slot]
      const value = cell === undefined ? Number.NaN : toNumber(cell, this.decimalComma)
      if (Number.isNaN(value)) throw cellError(lineIndex, column, cell)
      if (column.role === 'time') this.checkTime(value, lineIndex)
      else this.stores[slot]!.push(value * factor)
    }
    this.count++
  }

  private checkTime(time: number, lineIndex: number): void {
    if (time < this.lastTime)
      throw new TensileInputError(`Line ${lineIndex + 1}: time runs backwards`)
    this.lastTime = time
  }
}
