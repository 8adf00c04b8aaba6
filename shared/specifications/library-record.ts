import type { Specification, SpecificationBand } from '../schemas/specifications'
import type { SpecificationRecord } from '../tensile/specification'
import { MPA_PER_KSI } from '../tensile/units'

type LibraryRecord = Pick<
  Specification,
  'designation' | 'standard' | 'edition' | 'grade' | 'productForm' | 'units' | 'source'
>

/**
 * One size band of a library record as the engine's specification record, in MPa. Stresses
 * published in ksi are converted from the exact definition (1 ksi = 6.894757293168361 MPa, NIST
 * SP 811); percentages and hardness stay as published.
 */
export function bandAsSpecificationRecord(
  record: LibraryRecord,
  band: SpecificationBand,
): SpecificationRecord {
  const toMPa = (value: number) => (record.units === 'ksi' ? value * MPA_PER_KSI : value)
  const orNull = (value: number | null) => (value === null ? null : toMPa(value))
  const bounded = band.overMm !== null || band.upToMm !== null
  return {
    designation: record.designation,
    standard: record.standard,
    edition: record.edition,
    grade: record.grade,
    productForm: record.productForm,
    thicknessBandMm: bounded ? { over: band.overMm, upTo: band.upToMm } : null,
    yield: band.yield ? { minMPa: toMPa(band.yield.min), kind: band.yield.kind } : null,
    tensileStrength: {
      minMPa: orNull(band.tensileStrength.min),
      maxMPa: orNull(band.tensileStrength.max),
    },
    elongation: band.elongation.map((e) => ({ minPct: e.minPct, basis: { ...e.basis } })),
    reductionOfAreaMinPct: band.reductionOfAreaMinPct,
    hardness: band.hardness ? { ...band.hardness } : null,
    source: record.source,
  }
}
