import { chooseColumn, isMachineDisplacement, readHeadings, type ColumnHeading } from './columns'
import { detectDialect } from './dialect'
import { TensileInputError } from './errors'
import { mergeGeometry, resolveGeometry } from './geometry'
import { locateLayout } from './layout'
import { readBody, type BodyColumn } from './numeric-body'
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

/**
 * Reads a delimited tensile record: dialect, preamble geometry, header and units, then the
 * numeric body of the columns in use, converted to N, mm, strain fraction, MPa and s.
 */
export function importRecord(source: RecordSource, options: ImportOptions = {}): TensileRecord {
  const text = typeof source === 'string' ? source : [...source].join('')
  if (!/\S/.test(text)) throw new TensileInputError('The file is empty')
  const lines = text.split('\n')
  const dialect = detectDialect(lines, options)
  const layout = locateLayout(lines, dialect)
  const headings = readHeadings(layout)
  const fileGeometry = readPreambleGeometry(layout.preamble, dialect)
  const geometry = resolveGeometry(mergeGeometry(fileGeometry, options.geometry ?? {}))
  const columns = chooseColumns(headings, options, geometry).map(bodyColumn)
  const { values, count } = readBody(lines, layout.dataStart, dialect, columns)
  if (count < MINIMUM_POINTS) {
    throw new TensileInputError(
      `Only ${count} usable data points; at least ${MINIMUM_POINTS} are needed`,
    )
  }
  const byRole = (role: ColumnRole) =>
    values[columns.findIndex((c) => c.column.role === role)] ?? null
  return {
    columns: columns.map((entry) => entry.column),
    force: byRole('force'),
    extension: byRole('extension'),
    strain: byRole('strain'),
    stress: byRole('stress'),
    geometry,
    points: count,
    warnings: [],
  }
}
