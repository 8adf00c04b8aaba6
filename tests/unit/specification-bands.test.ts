import { describe, expect, it } from 'vitest'
import { starterAsLibraryRecord } from '../../server/services/specifications'
import type { Specification, SpecificationBand } from '../../shared/schemas/specifications'
import { judgeAgainstLink, NOT_LINKED } from '../../shared/specifications/case-conformity'
import { caseMaterialOf } from '../../shared/specifications/case-material'
import { bandAsSpecificationRecord } from '../../shared/specifications/library-record'
import { bandCovers, bandForSize, describeBand } from '../../shared/specifications/size-bands'
import { STARTER_SPECIFICATIONS, type SpecimenResult } from '../../shared/tensile'

const band = (over: number | null, upTo: number | null, extra: Partial<SpecificationBand> = {}) =>
  ({
    overMm: over,
    upToMm: upTo,
    yield: { min: 36, kind: 'ReH' },
    tensileStrength: { min: 58, max: 80 },
    elongation: [{ minPct: 20, basis: { kind: 'fixed', lengthMm: 200 } }],
    reductionOfAreaMinPct: null,
    hardness: null,
    ...extra,
  }) as SpecificationBand

const library = (bands: SpecificationBand[], units: 'MPa' | 'ksi' = 'ksi'): Specification => ({
  id: 7,
  designation: 'Plate test',
  standard: 'Test standard',
  edition: '2024',
  grade: 'Grade A',
  productForm: 'plate',
  units,
  bands,
  source: 'typed in for the test',
  unverified: false,
  checkedAgainstEdition: '2024',
  checkedBy: 1,
  checkedAt: '2026-01-01T00:00:00.000Z',
  version: 1,
})

describe('a library band as the engine’s specification record', () => {
  it('gives back every starter record the library was seeded from', () => {
    for (const starter of STARTER_SPECIFICATIONS) {
      const stored = starterAsLibraryRecord(starter)
      expect(bandAsSpecificationRecord(stored, stored.bands[0]!)).toEqual(starter)
    }
  })

  it('converts stresses published in ksi exactly and leaves percentages and hardness alone', () => {
    // NIST SP 811: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m, so 1 ksi = 6.894757293168361 MPa
    const ksi = 4.4482216152605 / 0.0254 ** 2 / 1e3
    const hardness = { min: null, max: 235, scale: 'HBW' }
    const record = bandAsSpecificationRecord(
      library([]),
      band(null, 50, { reductionOfAreaMinPct: 40, hardness }),
    )
    expect(record.yield?.minMPa).toBeCloseTo(36 * ksi, 9)
    expect(record.tensileStrength.minMPa).toBeCloseTo(58 * ksi, 9)
    expect(record.tensileStrength.maxMPa).toBeCloseTo(80 * ksi, 9)
    expect(record.elongation).toEqual([{ minPct: 20, basis: { kind: 'fixed', lengthMm: 200 } }])
    expect(record.reductionOfAreaMinPct).toBe(40)
    expect(record.hardness).toEqual(hardness)
    expect(record.thicknessBandMm).toEqual({ over: null, upTo: 50 })
    const unbounded = bandAsSpecificationRecord(library([], 'MPa'), band(null, null))
    expect(unbounded.thicknessBandMm).toBeNull()
    expect(unbounded.yield).toEqual({ minMPa: 36, kind: 'ReH' })
  })
})

describe('size bands', () => {
  // "over 16 up to 40 mm": above the lower bound, at most the upper one (common practice in the
  // product standards' tables)
  it('reads a band as the standards’ tables head it', () => {
    const middle = band(16, 40)
    expect(describeBand(middle)).toBe('over 16 up to 40 mm')
    expect(describeBand(band(null, 16))).toBe('up to 16 mm')
    expect(describeBand(band(250, null))).toBe('over 250 mm')
    expect(bandCovers(middle, 16)).toBe(false)
    expect(bandCovers(middle, 16.01)).toBe(true)
    expect(bandCovers(middle, 40)).toBe(true)
    expect(bandForSize([band(null, 16), middle, band(40, 100)], 60)).toBe(2)
    expect(bandForSize([band(null, 16)], 20)).toBeNull()
  })
})

describe('judging a result against the case’s link', () => {
  const result = {
    yieldStrengthsMPa: { '0.2': 260 },
    discontinuousYielding: true,
    upperYieldMPa: 262,
    tensileStrengthMPa: 420,
    elongationAfterFracturePct: 30,
    elongationAfterFractureFromLuPct: null,
    originalGaugeLengthMm: 200,
    crossSectionMm2: 500,
    diameterMm: null,
    reductionOfAreaPct: null,
    rt05MPa: null,
    lowerYieldMPa: 255,
  } as unknown as SpecimenResult

  it('says plainly when nothing is linked', () => {
    const material = caseMaterialOf(null, {
      specificationBand: null,
      sectionSizeMm: null,
      decisionRule: 'simple',
    })
    expect(judgeAgainstLink(result, {}, material)).toEqual({ judged: false, reason: NOT_LINKED })
  })

  it('judges in MPa against the chosen band of a ksi record', () => {
    // 36 ksi = 248.2 MPa and 58 ksi = 399.9 MPa: ReH 262 and Rm 420 clear both
    const record = library([band(null, 50), band(50, null, { yield: { min: 40, kind: 'ReH' } })])
    const link = { specificationBand: 1, sectionSizeMm: 60, decisionRule: 'simple' as const }
    const judged = judgeAgainstLink(result, {}, caseMaterialOf(record, link))
    // 40 ksi = 275.8 MPa: ReH 262 MPa falls short in the band over 50 mm
    expect(judged.judged && judged.conformity.items[0]).toMatchObject({
      property: 'ReH',
      verdict: 'fail',
    })
    expect(judged.judged && judged.link.band).toBe('over 50 mm')
    const thin = judgeAgainstLink(
      result,
      {},
      caseMaterialOf(record, { ...link, specificationBand: 0 }),
    )
    expect(thin.judged && thin.conformity.overall).toBe('pass')
  })

  it('compares ReL when the specification asks for the lower yield, and Rp0.2 without a yield point', () => {
    // ISO 6892-1 names ReL the lowest stress during plastic yielding; with continuous yielding
    // there is none, and Rp0.2 stands in (common practice)
    const reL = { ...band(null, null), yield: { min: 250, kind: 'ReL' as const } }
    const material = caseMaterialOf(library([reL], 'MPa'), {
      specificationBand: 0,
      sectionSizeMm: null,
      decisionRule: 'simple',
    })
    const judged = judgeAgainstLink(result, {}, material)
    expect(judged.judged && judged.conformity.items[0]).toMatchObject({
      property: 'ReL',
      value: 255,
      verdict: 'pass',
    })
    const continuous = { ...result, discontinuousYielding: false } as SpecimenResult
    const instead = judgeAgainstLink(continuous, {}, material)
    expect(instead.judged && instead.conformity.items[0]).toMatchObject({
      property: 'Rp0.2',
      value: 260,
      note: 'continuous yielding: Rp0.2 compared in place of ReL',
    })
  })
})
