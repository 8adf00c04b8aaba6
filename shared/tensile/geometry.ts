import { TensileInputError } from './errors'
import type { GeometryInput, ResolvedGeometry, SectionInput } from './types'

function positive(value: number | undefined, what: string): number | undefined {
  if (value !== undefined && !(value > 0)) {
    throw new TensileInputError(`The ${what} must be a positive number`)
  }
  return value
}

function tubeArea(outerDiameterMm: number, wallMm: number): number {
  if (2 * wallMm > outerDiameterMm) {
    throw new TensileInputError('The tube wall is thicker than half the outer diameter')
  }
  const inner = outerDiameterMm - 2 * wallMm
  return (Math.PI / 4) * (outerDiameterMm ** 2 - inner ** 2)
}

/**
 * Cross-section area S0 (or Su) from what was given. A stated area wins over dimensions because
 * labs state it when they measured it (common practice); then tube, rectangle, round.
 */
export function sectionArea(section: SectionInput | undefined): number | null {
  if (section === undefined) return null
  const area = positive(section.areaMm2, 'cross-section area')
  if (area !== undefined) return area
  const outer = positive(section.outerDiameterMm, 'outer diameter')
  const wall = positive(section.wallMm, 'wall thickness')
  if (outer !== undefined && wall !== undefined) return tubeArea(outer, wall)
  const width = positive(section.widthMm, 'width')
  const thickness = positive(section.thicknessMm, 'thickness')
  if (width !== undefined && thickness !== undefined) return width * thickness
  const diameter = positive(section.diameterMm, 'diameter')
  if (diameter !== undefined) return (Math.PI / 4) * diameter ** 2
  return null
}

function hasAnyField(section: SectionInput | undefined): section is SectionInput {
  return section !== undefined && Object.values(section).some((value) => value !== undefined)
}

/**
 * Options override the file's preamble. A section given as options replaces the preamble's
 * section as a whole, so a diameter on the command line is never mixed with a stated area.
 */
export function mergeGeometry(fromFile: GeometryInput, fromOptions: GeometryInput): GeometryInput {
  return {
    section: hasAnyField(fromOptions.section) ? fromOptions.section : fromFile.section,
    finalSection: hasAnyField(fromOptions.finalSection)
      ? fromOptions.finalSection
      : fromFile.finalSection,
    extensometerGaugeLengthMm:
      fromOptions.extensometerGaugeLengthMm ?? fromFile.extensometerGaugeLengthMm,
    originalGaugeLengthMm: fromOptions.originalGaugeLengthMm ?? fromFile.originalGaugeLengthMm,
    finalGaugeLengthMm: fromOptions.finalGaugeLengthMm ?? fromFile.finalGaugeLengthMm,
  }
}

export function resolveGeometry(input: GeometryInput): ResolvedGeometry {
  const le = positive(input.extensometerGaugeLengthMm, 'extensometer gauge length') ?? null
  const l0 = positive(input.originalGaugeLengthMm, 'original gauge length') ?? le
  return {
    areaMm2: sectionArea(input.section),
    diameterMm: input.section?.diameterMm ?? null,
    extensometerGaugeLengthMm: le,
    originalGaugeLengthMm: l0,
    finalGaugeLengthMm: positive(input.finalGaugeLengthMm, 'final gauge length') ?? null,
    finalAreaMm2: sectionArea(input.finalSection),
  }
}
