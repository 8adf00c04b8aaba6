import type { HardnessScale } from './scales'
import {
  STEEL_HRC_TABLE,
  STEEL_HRC_TABLE_SOURCE,
  TENSILE_ESTIMATE_MAX_HBW,
  TENSILE_ESTIMATE_SOURCE,
  TENSILE_PER_HBW_MPA,
} from './steel-conversion-table'

export interface HardnessConversion {
  /** every convertible scale, rounded as the tables print them; null outside the table */
  HRC: number | null
  HV: number | null
  HBW: number | null
  /** approximate tensile strength, MPa; null where no estimate applies */
  tensileMPa: number | null
  /** the tables used, named for the report */
  sources: string[]
  /** why a value is missing, in words */
  notes: string[]
}

const COLUMN = { HRC: 0, HV: 1, HBW: 2 } as const
type Convertible = keyof typeof COLUMN

const isConvertible = (scale: HardnessScale): scale is Convertible => scale in COLUMN

/** Linear interpolation along one column of the table, between the rows that bracket `value`. */
function interpolate(value: number, from: Convertible, to: Convertible): number | null {
  const rows = STEEL_HRC_TABLE.filter(
    (row) => row[COLUMN[from]] !== null && row[COLUMN[to]] !== null,
  )
  for (let i = 1; i < rows.length; i++) {
    const low = rows[i - 1]!
    const high = rows[i]!
    const x0 = low[COLUMN[from]] as number
    const x1 = high[COLUMN[from]] as number
    if (value < x0 || value > x1) continue
    const y0 = low[COLUMN[to]] as number
    const y1 = high[COLUMN[to]] as number
    return y0 + ((value - x0) / (x1 - x0)) * (y1 - y0)
  }
  return null
}

const round = (value: number | null, step: number) =>
  value === null ? null : Math.round(value / step) * step

/**
 * A steel hardness reading on the other scales (ASTM E140 Table 1) with an approximate tensile
 * strength. Conversions are approximate by nature: E140 itself says so, and the report marks them
 * as estimates with the table named.
 */
export function convertSteelHardness(value: number, scale: HardnessScale): HardnessConversion {
  const notes: string[] = []
  if (!isConvertible(scale)) {
    return {
      HRC: null,
      HV: null,
      HBW: null,
      tensileMPa: null,
      sources: [],
      notes: [`No conversion from ${scale} is offered.`],
    }
  }
  const at = (to: Convertible) => (to === scale ? value : interpolate(value, scale, to))
  const hrc = round(at('HRC'), 0.5)
  const hv = round(at('HV'), 1)
  const hbw = round(at('HBW'), 1)
  if (hrc === null || hv === null) notes.push(`${value} ${scale} is outside the conversion table.`)
  else if (hbw === null) notes.push('Brinell is not given at this hardness.')
  let tensileMPa: number | null = null
  if (hbw !== null && hbw <= TENSILE_ESTIMATE_MAX_HBW)
    tensileMPa = round(hbw * TENSILE_PER_HBW_MPA, 5)
  else if (hbw !== null) notes.push(`No tensile estimate above ${TENSILE_ESTIMATE_MAX_HBW} HBW.`)
  const sources = [STEEL_HRC_TABLE_SOURCE]
  if (tensileMPa !== null) sources.push(TENSILE_ESTIMATE_SOURCE)
  return { HRC: hrc, HV: hv, HBW: hbw, tensileMPa, sources, notes }
}
