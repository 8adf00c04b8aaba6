import { readHeadings, type ColumnHeading } from './columns'
import { buildCurve } from './curve'
import { detectDialect, type Dialect } from './dialect'
import { TensileInputError } from './errors'
import { importRecord } from './import-record'
import { locateLayout } from './layout'
import { checkTensileOptions, type TensileOptions } from './options'
import { analyseSpecimens, type SpecimenResult } from './pipeline'
import { resolveOptions } from './resolve-options'
import type { UsedColumn } from './types'

/** Lines the preview reads to show the file's head; the analysis itself reads every line. */
const HEAD_LINES = 5000
const SHOWN_ROWS = 8

export interface CurvePoint {
  x: number
  y: number
}

/** What the upload page shows before anything is saved, computed by the engine itself. */
export interface RecordPreview {
  dialect: Dialect | null
  headings: ColumnHeading[]
  /** the preamble's key–value rows: specimen id, temperature, standard, date … */
  preamble: string[][]
  firstRows: string[]
  usedColumns: UsedColumn[]
  /** engineering strain (%) and stress (MPa), thinned for display only */
  curve: CurvePoint[]
  result: SpecimenResult | null
  /** the engine's refusal, worded as the server will word it */
  problem: string | null
}

/**
 * Thins a curve to about `target` points for drawing, keeping each stretch's lowest and highest
 * stress so peaks and drops stay visible; the computation always uses every point.
 */
export function thinCurve(strain: ArrayLike<number>, stress: ArrayLike<number>, target = 1500) {
  const points: CurvePoint[] = []
  const step = Math.max(1, Math.ceil(strain.length / (target / 2)))
  for (let start = 0; start < strain.length; start += step) {
    const end = Math.min(strain.length, start + step)
    let low = start
    let high = start
    for (let i = start; i < end; i++) {
      if (stress[i]! < stress[low]!) low = i
      if (stress[i]! > stress[high]!) high = i
    }
    const chosen = low === high ? [low] : low < high ? [low, high] : [high, low]
    for (const i of chosen) points.push({ x: strain[i]! * 100, y: stress[i]! })
  }
  return points
}

function head(text: string, options: TensileOptions) {
  const lines = text.split(/\r?\n/, HEAD_LINES)
  const whole = lines.length < HEAD_LINES
  const dialect = detectDialect(lines, resolveOptions(options).analysis)
  const layout = locateLayout(lines, dialect, whole)
  return {
    dialect,
    headings: readHeadings(layout),
    preamble: layout.preamble.filter((row) => row.some((cell) => cell.trim() !== '')),
    firstRows: lines.slice(layout.dataStart, layout.dataStart + SHOWN_ROWS),
  }
}

function empty(problem: string): RecordPreview {
  const none = { dialect: null, headings: [], preamble: [], firstRows: [], usedColumns: [] }
  return { ...none, curve: [], result: null, problem }
}

/** The file's head, the columns the engine chose, the curve and every property, or the reason not. */
export function previewRecord(name: string, text: string, input: unknown): RecordPreview {
  let options: TensileOptions
  try {
    options = checkTensileOptions(input)
  } catch (error) {
    if (error instanceof TensileInputError) return empty(error.message)
    throw error
  }
  const preview = empty('')
  try {
    Object.assign(preview, head(text, options))
    const record = importRecord(text, resolveOptions(options).analysis)
    preview.usedColumns = record.columns
    const curve = buildCurve(record)
    preview.curve = thinCurve(curve.strain, curve.stress)
    const report = analyseSpecimens([{ name, source: text }], options)
    preview.result = Array.isArray(report) ? null : report
    preview.problem = null
  } catch (error) {
    if (!(error instanceof TensileInputError)) throw error
    preview.problem = `${name}: ${error.message}`
  }
  return preview
}
