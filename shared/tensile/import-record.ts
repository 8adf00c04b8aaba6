import { chooseColumn, isMachineDisplacement, readHeadings, type ColumnHeading } from './columns'
import { detectDialect } from './dialect'
import { TensileInputError } from './errors'
import { mergeGeometry, resolveGeometry } from './geometry'
import { locateLayout } from './layout'
import { RECORD_LIMITS } from './limits'
import { BodyReader, type BodyColumn } from './numeric-body'
import { RecordReader } from './record-reader'
import { readPreambleGeometry } from './preamble'
import type {
  ColumnRole,
  ImportOptions,
  RecordSource,
  ResolvedGeometry,
  TensileRecord,
  UsedColumn,
} from './types'
import { requireUnitFactor, type Quantity } from './units'

/** Fewer points than this cannot support an elastic fit and a yield search (common practice). */
export const MINIMUM_POINTS = 20

const ROLE_QUANTITY: Readonly<Record<ColumnRole, Quantity>> = {
  force: 'force',
  extension: 'length',
  strain: 'strain',
  stress: 'stress',
  time: 'time',
}

function pick(headings: readonly ColumnHeading[], role: ColumnRole, options: ImportOptions) {
  return chooseColumn(headings, role, options.columns?.[role], options.units?.[role])
}

/** Force over S0 when S0 is known, else a stress column; an override names the choice. */
function chooseLoad(
  headings: readonly ColumnHeading[],
  options: ImportOptions,
  area: number | null,
) {
  const force = pick(headings, 'force', options)
  const stress = pick(headings, 'stress', options)
  const preferStress = options.columns?.stress !== undefined || area === null
  if (stress !== null && (preferStress || force === null)) return stress
  if (force === null) throw new TensileInputError('No force or stress column found in the header')
  if (area === null) {
    throw new TensileInputError(
      'The cross-section is not known: give the diameter, width and thickness, tube size or area',
    )
  }
  return force
}

/** Extension over Le when Le is known (extensometer preferred), else a strain column. */
function chooseDeformation(
  headings: readonly ColumnHeading[],
  options: ImportOptions,
  le: number | null,
) {
  const extension = pick(headings, 'extension', options)
  const strain = pick(headings, 'strain', options)
  const machineOnly =
    extension !== null &&
    options.columns?.extension === undefined &&
    isMachineDisplacement(extension.name)
  const preferStrain = options.columns?.strain !== undefined || le === null || machineOnly
  if (strain !== null && (preferStrain || extension === null)) return strain
  if (extension === null)
    throw new TensileInputError('No extension or strain column found in the header')
  if (le === null) {
    throw new TensileInputError('The extensometer gauge length is not known: give the gauge length')
  }
  return extension
}

function chooseColumns(
  headings: readonly ColumnHeading[],
  options: ImportOptions,
  geometry: ResolvedGeometry,
) {
  const used = [
    chooseLoad(headings, options, geometry.areaMm2),
    chooseDeformation(headings, options, geometry.extensometerGaugeLengthMm),
  ]
  const time = pick(headings, 'time', options)
  if (time !== null && !used.some((column) => column.position === time.position)) used.push(time)
  return used
}

function bodyColumn(column: UsedColumn): BodyColumn {
  return { column, factor: requireUnitFactor(column.unit, ROLE_QUANTITY[column.role], column.name) }
}

interface Head {
  lines: string[]
  /** Characters of the head, line breaks included. */
  characters: number
  /** The head is the whole record: it ended before the head's limits. */
  whole: boolean
}

/** The first lines, where the preamble, the header and the first data rows are. */
function readHead(reader: RecordReader): Head {
  const lines: string[] = []
  let characters = 0
  while (lines.length < RECORD_LIMITS.headLines && characters < RECORD_LIMITS.headCharacters) {
    if (!reader.next()) return { lines, characters, whole: true }
    const line = reader.lineText()
    lines.push(line)
    characters += line.length + 1
  }
  return { lines, characters, whole: false }
}

/**
 * Points to expect, from the record's length and the length of the data lines in the head,
 * with a margin; 0 when the length is not known. An estimate on the high side costs nothing
 * but address space, since the unwritten end of an array is never touched.
 */
function expectedPoints(source: RecordSource, head: Head, dataStart: number): number {
  const total = typeof source === 'string' ? source.length : source.characters
  const bodyLines = head.lines.length - dataStart
  if (total === undefined || bodyLines <= 0) return 0
  let bodyCharacters = 0
  for (let i = dataStart; i < head.lines.length; i++) bodyCharacters += head.lines[i]!.length + 1
  const rest = Math.max(0, total - head.characters) / Math.max(1, bodyCharacters / bodyLines)
  return Math.min(RECORD_LIMITS.points, Math.ceil(bodyLines + rest * 1.1) + 64)
}

function readBody(reader: RecordReader, head: Head, from: number, body: BodyReader) {
  for (let i = from; i < head.lines.length; i++) {
    const line = head.lines[i]!
    body.addLine(line, 0, line.length, i, line.includes('"'))
  }
  while (reader.next())
    body.addLine(reader.text, reader.start, reader.end, reader.line, reader.hasQuote())
}

/**
 * Reads a delimited tensile record: dialect, preamble geometry, header and units from its
 * first lines, then the numeric body of the columns in use, line by line, converted to N, mm,
 * strain fraction and MPa. The record may come in chunks; it is never held whole.
 */
export function importRecord(source: RecordSource, options: ImportOptions = {}): TensileRecord {
  const reader = new RecordReader(source)

  const head = readHead(reader)
  if (head.whole && !head.lines.some((line) => /\S/.test(line)))
    throw new TensileInputError('The file is empty')
  const dialect = detectDialect(head.lines, options)
  const layout = locateLayout(head.lines, dialect, head.whole)
  const headings = readHeadings(layout)
  const fileGeometry = readPreambleGeometry(layout.preamble, dialect)
  const geometry = resolveGeometry(mergeGeometry(fileGeometry, options.geometry ?? {}))
  const columns = chooseColumns(headings, options, geometry).map(bodyColumn)
  const body = new BodyReader(columns, dialect, expectedPoints(source, head, layout.dataStart))
  readBody(reader, head, layout.dataStart, body)
  if (body.count < MINIMUM_POINTS) {
    throw new TensileInputError(
      `Only ${body.count} usable data points; at least ${MINIMUM_POINTS} are needed`,
    )
  }
  const values = body.values()
  const byRole = (role: ColumnRole) =>
    role === 'time' ? null : (values[columns.findIndex((c) => c.column.role === role)] ?? null)
  return {
    columns: columns.map((entry) => entry.column),
    force: byRole('force'),
    extension: byRole('extension'),
    strain: byRole('strain'),
    stress: byRole('stress'),
    geometry,
    points: body.count,
    warnings: [],
  }
}
