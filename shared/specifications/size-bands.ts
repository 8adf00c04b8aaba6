import type { SpecificationBand } from '../schemas/specifications'

type Bounds = Pick<SpecificationBand, 'overMm' | 'upToMm'>

/** A band in words, as the standards' tables head them: "over 16 up to 40 mm". */
export function describeBand(band: Bounds): string {
  const { overMm, upToMm } = band
  if (overMm === null && upToMm === null) return 'any section size'
  if (overMm === null) return `up to ${upToMm} mm`
  if (upToMm === null) return `over ${overMm} mm`
  return `over ${overMm} up to ${upToMm} mm`
}

/**
 * Whether a section size falls in a band: above its lower bound and at most its upper one, the
 * way "over 16 up to 40 mm" is read in the product standards' tables (common practice).
 */
export function bandCovers(band: Bounds, sizeMm: number): boolean {
  const aboveLower = band.overMm === null || sizeMm > band.overMm
  const withinUpper = band.upToMm === null || sizeMm <= band.upToMm
  return aboveLower && withinUpper
}

/** The index of the first band that covers the size, or null when none does. */
export function bandForSize(bands: readonly Bounds[], sizeMm: number): number | null {
  const index = bands.findIndex((band) => bandCovers(band, sizeMm))
  return index === -1 ? null : index
}
