import { describe, expect, it } from 'vitest'
import {
  evaluateConformity,
  findSpecification,
  type ConformityBasis,
  type SpecificationRecord,
  type TensileResult,
} from '../../../shared/tensile'

/** A result that passes everything; each test moves one value around one limit. */
function result(overrides: Partial<TensileResult> = {}): TensileResult {
  const area = (Math.PI / 4) * 10 ** 2 // d0 = 10 mm, so 5.65√S0 = 50.07 mm and 4D = 40 mm
  return {
    modulusGPa: 205,
    modulusFit: {
      fromMPa: 40,
      toMPa: 250,
      rSquared: 0.9999,
      points: 100,
      chosenBy: 'automatic',
      rounded: false,
      fromPoint: 20,
      toPoint: 119,
      fromStrainPct: 0.02,
      toStrainPct: 0.12,
    },
    strainOriginShiftPct: 0,
    proportionalLimitMPa: 300,
    offsetPct: 0.2,
    yieldStrengthMPa: 400,
    yieldStrengthsMPa: { '0.2': 400 },
    rt05MPa: 405,
    discontinuousYielding: true,
    upperYieldMPa: 400,
    lowerYieldMPa: 390,
    yieldPointElongationPct: 1.5,
    tensileStrengthMPa: 550,
    maximumForceN: 550 * area,
    uniformElongationPct: 15,
    totalElongationAtMaxForcePct: 15.3,
    trueStressAtMaxForceMPa: 630,
    trueStrainAtMaxForce: 0.14,
    fractureStrengthMPa: 420,
    elongationAfterFracturePct: 28,
    elongationAfterFractureFromLuPct: null,
    reductionOfAreaPct: 60,
    strainHardeningExponent: 0.18,
    strengthCoefficientMPa: 800,
    hardeningFit: { fromPct: 10, toPct: 15, points: 50, rSquared: 0.999 },
    resilienceMJm3: 0.39,
    toughnessMJm3: 140,
    crossSectionMm2: area,
    diameterMm: 10,
    extensometerGaugeLengthMm: 50,
    originalGaugeLengthMm: 50,
    points: 2000,
    warnings: [],
    ...overrides,
  }
}

function spec(designation: string): SpecificationRecord {
  const found = findSpecification(designation)
  if (found === null) throw new Error(designation)
  return found
}

const SIMPLE: ConformityBasis = { rule: 'simple', uncertainty: null, edition: null }
const GUARD: ConformityBasis = {
  rule: 'guard',
  uncertainty: {
    expanded: { 'Rp0.2': 5, ReH: 5, 'Rt0.5': 5, Rm: 5, A: 1, Z: 1 },
    source: 'uncertainty budget of the tensile machine',
  },
  edition: null,
}

function verdictOf(
  r: TensileResult,
  s: SpecificationRecord,
  rule: ConformityBasis,
  property: string,
  bound = 'min',
) {
  const item = evaluateConformity(r, s, rule).items.find(
    (i) => i.property === property && i.bound === bound,
  )
  return item?.verdict
}

// The limits are the starter records' own (S355J2: ReH ≥ 355 MPa, 470 ≤ Rm ≤ 630 MPa,
// A ≥ 22 % on 5.65√S0). The rules: simple acceptance compares the value rounded as reported
// (ASTM E29, 1 MPa); the guard band passes only beyond U and fails only beyond U
// (ISO/IEC 17025 7.8.6 and ILAC-G8 practice, recalled from memory).
describe('simple acceptance around a minimum (ReH ≥ 355 MPa)', () => {
  const s355 = spec('S355J2')
  it.each([
    [356, 'pass'],
    [355.4, 'pass'], // rounds to 355: on the limit
    [355, 'pass'],
    [354.6, 'pass'], // rounds up to 355 before comparison
    [354.4, 'fail'], // rounds to 354
    [340, 'fail'],
  ])('ReH = %s MPa → %s', (value, verdict) => {
    expect(verdictOf(result({ upperYieldMPa: value }), s355, SIMPLE, 'ReH')).toBe(verdict)
  })
})

describe('simple acceptance around a maximum (Rm ≤ 630 MPa)', () => {
  const s355 = spec('S355J2')
  it.each([
    [629, 'pass'],
    [630.4, 'pass'],
    [630.6, 'fail'],
  ])('Rm = %s MPa → %s', (value, verdict) => {
    expect(verdictOf(result({ tensileStrengthMPa: value }), s355, SIMPLE, 'Rm', 'max')).toBe(
      verdict,
    )
  })
})

describe('guard band of U = 5 MPa around ReH ≥ 355 MPa', () => {
  const s355 = spec('S355J2')
  it.each([
    [360.1, 'pass'],
    [360, 'inconclusive'], // clears the limit by exactly U, not by more
    [357, 'inconclusive'],
    [355, 'inconclusive'],
    [352, 'inconclusive'],
    [350, 'inconclusive'],
    [349.9, 'fail'],
  ])('ReH = %s MPa → %s', (value, verdict) => {
    expect(verdictOf(result({ upperYieldMPa: value }), s355, GUARD, 'ReH')).toBe(verdict)
  })

  it('guards a maximum from the other side (Rm ≤ 630 MPa)', () => {
    expect(verdictOf(result({ tensileStrengthMPa: 624.9 }), s355, GUARD, 'Rm', 'max')).toBe('pass')
    expect(verdictOf(result({ tensileStrengthMPa: 633 }), s355, GUARD, 'Rm', 'max')).toBe(
      'inconclusive',
    )
    expect(verdictOf(result({ tensileStrengthMPa: 635.1 }), s355, GUARD, 'Rm', 'max')).toBe('fail')
  })

  it('uses U in percentage points for elongation (A ≥ 22 %)', () => {
    expect(
      verdictOf(result({ elongationAfterFracturePct: 23.1 }), s355, GUARD, 'A (5.65√S0)'),
    ).toBe('pass')
    expect(
      verdictOf(result({ elongationAfterFracturePct: 22.5 }), s355, GUARD, 'A (5.65√S0)'),
    ).toBe('inconclusive')
    expect(
      verdictOf(result({ elongationAfterFracturePct: 20.9 }), s355, GUARD, 'A (5.65√S0)'),
    ).toBe('fail')
  })
})

describe('gauge-length basis of elongation', () => {
  it('rounds A to 0.5 % before a simple comparison', () => {
    const s355 = spec('S355J2')
    expect(
      verdictOf(result({ elongationAfterFracturePct: 21.8 }), s355, SIMPLE, 'A (5.65√S0)'),
    ).toBe('pass')
    expect(
      verdictOf(result({ elongationAfterFracturePct: 21.7 }), s355, SIMPLE, 'A (5.65√S0)'),
    ).toBe('fail')
  })

  it('calls an elongation on another gauge length not comparable, and the whole incomplete', () => {
    const conformity = evaluateConformity(
      result({ originalGaugeLengthMm: 80 }),
      spec('S355J2'),
      SIMPLE,
    )
    const elongation = conformity.items.find((item) => item.property.startsWith('A '))
    expect(elongation?.verdict).toBe('not comparable')
    expect(conformity.overall).toBe('incomplete')
  })

  it('picks the requirement whose basis matches the specimen (A36: 23 % in 50 mm, 20 % in 200 mm)', () => {
    const a36 = spec('A36')
    const on50 = evaluateConformity(result({ elongationAfterFracturePct: 22 }), a36, SIMPLE)
    expect(on50.items.find((i) => i.property === 'A (50 mm)')?.verdict).toBe('fail')
    const on200 = evaluateConformity(
      result({ originalGaugeLengthMm: 200, elongationAfterFracturePct: 22 }),
      a36,
      SIMPLE,
    )
    expect(on200.items.find((i) => i.property === 'A (200 mm)')?.verdict).toBe('pass')
  })

  it('works out a 4D basis from the diameter (A193 B7: 16 % in 4D, Z ≥ 50 %)', () => {
    const b7 = spec('A193-B7')
    const r = result({
      originalGaugeLengthMm: 40,
      elongationAfterFracturePct: 17,
      reductionOfAreaPct: 49.4,
    })
    const conformity = evaluateConformity(r, b7, SIMPLE)
    expect(conformity.items.find((i) => i.property === 'A (4D)')?.verdict).toBe('pass')
    expect(conformity.items.find((i) => i.property === 'Z')?.verdict).toBe('fail') // 49.4 rounds to 49
    expect(conformity.overall).toBe('fail')
  })
})

describe('which yield is compared', () => {
  it('compares Rp0.2 in place of ReH when yielding is continuous, and says so', () => {
    const conformity = evaluateConformity(
      result({
        discontinuousYielding: false,
        upperYieldMPa: null,
        yieldStrengthsMPa: { '0.2': 354 },
      }),
      spec('S355J2'),
      SIMPLE,
    )
    const item = conformity.items[0]
    expect(item?.property).toBe('Rp0.2')
    expect(item?.verdict).toBe('fail')
    expect(item?.note).toMatch(/in place of ReH/)
  })

  it('names the specification and the rule, and passes a result that meets every limit', () => {
    const conformity = evaluateConformity(result(), spec('S355J2'), GUARD)
    expect(conformity.overall).toBe('pass')
    expect(conformity.specification.standard).toBe('EN 10025-2')
    expect(conformity.rule).toMatch(/guard band .* 5 MPa/)
  })

  it('leaves hardness not measured, so the overall verdict is incomplete', () => {
    const conformity = evaluateConformity(
      result({ yieldStrengthsMPa: { '0.2': 300 }, elongationAfterFracturePct: 45 }),
      spec('A240-304'),
      SIMPLE,
    )
    expect(conformity.items.find((i) => i.property.startsWith('hardness'))?.verdict).toBe(
      'not measured',
    )
    expect(conformity.overall).toBe('incomplete')
  })
})

describe('starter specification records', () => {
  it('are each marked as recalled from memory and name their standard', () => {
    for (const designation of [
      'A36',
      'A572-50',
      'A240-304',
      'A240-316L',
      'B209-6061-T6',
      'A193-B7',
      'S235JR',
      'S355J2',
    ]) {
      const record = spec(designation)
      expect(record.standard).toMatch(/^(ASTM|EN) /)
      expect(record.source).toBe('recalled from memory, not read from the standard')
    }
  })
})

// ISO/IEC 17025 7.8.6 (recalled from memory): the decision rule and the uncertainty it uses are
// stated with the statement of conformity; the lab's U differs from property to property.
describe('measurement uncertainty as an input to conformity', () => {
  const s355 = spec('S355J2')
  const perProperty: ConformityBasis = {
    rule: 'guard',
    uncertainty: { expanded: { 'Rp0.2': 8, Rm: 3, A: 0.4 }, source: 'budget TB-7, k = 2' },
    edition: '2019',
  }
  const continuous = result({
    discontinuousYielding: false,
    upperYieldMPa: null,
    yieldStrengthsMPa: { '0.2': 361 },
    tensileStrengthMPa: 474,
    elongationAfterFracturePct: 22.5,
  })
  const conformity = evaluateConformity(continuous, s355, perProperty)
  const item = (property: string, bound = 'min') =>
    conformity.items.find((i) => i.property === property && i.bound === bound)

  it('guards each property with its own U', () => {
    expect(item('Rp0.2')).toMatchObject({ uncertainty: 8, verdict: 'inconclusive' }) // 361 − 355 < 8
    expect(item('Rm')).toMatchObject({ uncertainty: 3, verdict: 'pass' }) // 474 − 470 > 3
    expect(item('A (5.65√S0)')).toMatchObject({ uncertainty: 0.4, verdict: 'pass' }) // 0.5 > 0.4
  })

  it('calls an item inconclusive when no U was stated for it under the guard band', () => {
    const noRm = evaluateConformity(continuous, s355, {
      ...perProperty,
      uncertainty: { expanded: { 'Rp0.2': 8 }, source: null },
    })
    const rm = noRm.items.find((i) => i.property === 'Rm' && i.bound === 'min')
    expect(rm?.verdict).toBe('inconclusive')
    expect(rm?.note).toMatch(/no expanded uncertainty stated for Rm/)
  })

  it('states the source of U, the rule and the cited edition with the verdict', () => {
    expect(conformity.uncertainty?.source).toBe('budget TB-7, k = 2')
    expect(conformity.rule).toMatch(/guard band.*Rp0\.2 8 MPa.*budget TB-7/)
    expect(conformity.specification.edition).toBe('2019')
  })

  it('reports U beside each value under simple acceptance without using it', () => {
    const simple = evaluateConformity(continuous, s355, { ...perProperty, rule: 'simple' })
    const rp = simple.items.find((i) => i.property === 'Rp0.2')
    expect(rp).toMatchObject({ uncertainty: 8, verdict: 'pass' })
    expect(simple.rule).toMatch(/simple acceptance.*not used in the decision/)
  })

  it('marks every verdict indicative: a failed part’s specimens are not its test pieces', () => {
    expect(conformity.caution).toMatch(/specimens cut from a failed part/)
    expect(conformity.caution).toMatch(/location, orientation and size/)
  })
})
