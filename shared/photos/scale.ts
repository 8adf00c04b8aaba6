/** Distances and scale bars on a calibrated photo; lengths in micrometres. */

export interface Point {
  x: number
  y: number
}

export const pixelDistance = (from: Point, to: Point) => Math.hypot(to.x - from.x, to.y - from.y)

/** Micrometres per pixel from a line drawn over a known length. */
export function calibrate(from: Point, to: Point, micrometres: number): number {
  const pixels = pixelDistance(from, to)
  if (!(pixels > 0) || !(micrometres > 0))
    throw new RangeError('a calibration needs a line and a length')
  return micrometres / pixels
}

/** A length written in the unit that keeps it between 1 and 1000 (nm, µm, mm, m). */
export function formatLength(micrometres: number): string {
  const units: [string, number][] = [
    ['m', 1e6],
    ['mm', 1e3],
    ['µm', 1],
    ['nm', 1e-3],
  ]
  const [unit, size] = units.find(([, size]) => micrometres >= size) ?? units[units.length - 1]!
  const value = micrometres / size
  const digits = value >= 100 ? 0 : value >= 10 ? 1 : 2
  return `${Number(value.toFixed(digits))} ${unit}`
}

/**
 * The scale bar for an image: the largest round length (1, 2 or 5 × 10ⁿ µm) that spans no more
 * than `share` of the image's width (a fifth by default, common practice for micrographs).
 */
export function scaleBar(micrometresPerPixel: number, imageWidth: number, share = 0.2) {
  const longest = micrometresPerPixel * imageWidth * share
  const decade = 10 ** Math.floor(Math.log10(longest))
  const step = [5, 2, 1].find((factor) => factor * decade <= longest * (1 + 1e-9)) ?? 1
  const micrometres = step * decade
  return {
    micrometres,
    pixels: micrometres / micrometresPerPixel,
    label: formatLength(micrometres),
  }
}
