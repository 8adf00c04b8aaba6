import { splitTrailingUnit, withoutBrackets } from './brackets'
import { TensileInputError } from './errors'
import { quoted } from './printable'
import type { RecordLayout } from './layout'
import type { ColumnRole, UsedColumn } from './types'
import { unitFactor } from './units'

/** One column as the header names it. */
export interface ColumnHeading {
  position: number
  name: string
  unit: string
}

function splitNameAndUnit(cell: string, unitsRowCell: string | undefined): [string, string] {
  return splitTrailingUnit(cell) ?? [cell.trim(), withoutBrackets(unitsRowCell ?? '').trim()]
}

/** Column names and units from the header and the units row (brackets in the header win). */
export function readHeadings(layout: RecordLayout): ColumnHeading[] {
  const headings: ColumnHeading[] = []
  for (let position = 0; position < layout.width; position++) {
    const cell = layout.header?.[position] ?? ''
    const [name, unit] = splitNameAndUnit(cell, layout.unitsRow?.[position])
    headings.push({ position, name: name === '' ? `column ${position + 1}` : name, unit })
  }
  return headings
}

const DERIVED = /\b(true|log|logarithmic|rate|speed|velocity)\b/
const MACHINE = /machine|crosshead|cross-head|stroke|piston|traverse|position|actuator/
const EXTENSOMETER = /extensometer|extens/

/** Crosshead or machine displacement: includes the load train, so second choice to an extensometer. */
export function isMachineDisplacement(name: string): boolean {
  return MACHINE.test(name.toLowerCase())
}

/** How well a heading fits a role: 0 not at all; higher is preferred. */
function roleScore(heading: ColumnHeading, role: ColumnRole): number {
  const name = heading.name.toLowerCase()
  if (DERIVED.test(name) && role !== 'time') return 0
  const isStrainUnit = unitFactor(heading.unit, 'strain') !== null && heading.unit !== ''
  const isLengthUnit = unitFactor(heading.unit, 'length') !== null
  switch (role) {
    case 'time':
      return /\btime\b|zeit|^t$/.test(name) ? 1 : 0
    case 'force':
      return /force|load|kraft|^f$/.test(name) && !/stress/.test(name) ? 1 : 0
    case 'stress':
      return /stress|spannung|^sigma|^σ/.test(name) ? 1 : 0
    case 'strain':
      if (/strain|dehnung|^eps|^ε/.test(name)) return isLengthUnit ? 0 : 2
      return /elongation|extension/.test(name) && isStrainUnit ? 1 : 0
    case 'extension':
      if (!/extens|elongation|displacement|deformation|längenänderung|^dl$|delta/.test(name))
        return 0
      if (isStrainUnit && !isLengthUnit) return 0
      if (MACHINE.test(name)) return 1
      return EXTENSOMETER.test(name) ? 3 : 2
  }
}

function detectRole(headings: readonly ColumnHeading[], role: ColumnRole): ColumnHeading | null {
  let best: ColumnHeading | null = null
  let bestScore = 0
  for (const heading of headings) {
    const score = roleScore(heading, role)
    if (score > bestScore) [best, bestScore] = [heading, score]
  }
  return best
}

function findByOverride(headings: readonly ColumnHeading[], wanted: string): ColumnHeading {
  const position = /^\d+$/.test(wanted.trim()) ? Number(wanted) - 1 : -1
  const lower = wanted.trim().toLowerCase()
  const found = headings.find((h) => h.position === position || h.name.toLowerCase() === lower)
  if (!found) throw new TensileInputError(`No column ${quoted(wanted)} in the record`)
  return found
}

/**
 * Picks the column for a role: the override when given, else the best match by name, the
 * extensometer preferred over crosshead or machine displacement.
 */
export function chooseColumn(
  headings: readonly ColumnHeading[],
  role: ColumnRole,
  override: string | undefined,
  unitOverride: string | undefined,
): UsedColumn | null {
  const heading =
    override === undefined ? detectRole(headings, role) : findByOverride(headings, override)
  if (heading === null) return null
  return {
    role,
    position: heading.position,
    name: heading.name,
    unit: unitOverride ?? heading.unit,
  }
}
