import fc from 'fast-check'
import { describe, it } from 'vitest'
import {
  analyseCurve,
  analyseRecord,
  type EngineeringCurve,
  type TensileResult,
} from '../../../shared/tensile'
import { rambergOsgoodCurve, withToe, type SyntheticCurve } from '../../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord, type RecordFormat } from '../../helpers/tensile/dialects'
import { STRUCTURAL_STEEL } from '../../helpers/tensile/specimens'

const base = rambergOsgoodCurve({ ...STRUCTURAL_STEEL, samples: 1500 })

function engineering(curve: SyntheticCurve, stressScale = 1): EngineeringCurve {
  return {
    strain: Float64Array.from(curve.strain),
    stress: Float64Array.from(curve.stressMPa, (s) => s * stressScale),
    geometry: {
      areaMm2: 78.5,
      diameterMm: 10,
      extensometerGaugeLengthMm: 50,
      originalGaugeLengthMm: 50,
      finalGaugeLengthMm: null,
      finalAreaMm2: null,
    },
  }
}

const closeTo = (a: number | null, b: number | null, tolerance: number) =>
  a !== null && b !== null && Math.abs(a - b) <= tolerance * Math.max(1, Math.abs(b))

const reference = analyseCurve(engineering(base))

// Engineering stress is F/S0 (ISO 6892-1): scaling every force by k scales every stress by k and
// leaves every strain alone; this is a property of the definition, not of a reference value.
describe('scaling the force', () => {
  it('scales stresses and the slope, and leaves elongations unchanged', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.2, max: 5, noNaN: true }), (k) => {
        const scaled = analyseCurve(engineering(base, k))
        return (
          closeTo(scaled.tensileStrengthMPa, k * reference.tensileStrengthMPa, 1e-9) &&
          closeTo(scaled.yieldStrengthMPa, k * (reference.yieldStrengthMPa ?? 0), 1e-6) &&
          closeTo(scaled.modulusGPa, k * reference.modulusGPa, 1e-6) &&
          closeTo(scaled.uniformElongationPct, reference.uniformElongationPct, 1e-6) &&
          closeTo(scaled.elongationAfterFracturePct, reference.elongationAfterFracturePct, 1e-6)
        )
      }),
      { numRuns: 25 },
    )
  })
})

const formatArbitrary: fc.Arbitrary<RecordFormat> = fc.record({
  delimiter: fc.constantFrom(',' as const, ';' as const, '\t' as const),
  decimal: fc.constantFrom('.' as const, ',' as const),
  forceUnit: fc.constantFrom('N' as const, 'kN' as const, 'lbf' as const, 'kgf' as const),
  lengthUnit: fc.constantFrom('mm' as const, 'in' as const),
  strainInPercent: fc.boolean(),
  unitStyle: fc.constantFrom('brackets' as const, 'parentheses' as const, 'row' as const),
  preamble: fc.constant(true),
  order: fc.shuffledSubarray([0, 1, 2, 3, 4], { minLength: 5, maxLength: 5 }),
})

function sameResults(a: TensileResult, b: TensileResult): boolean {
  const keys = [
    'modulusGPa',
    'yieldStrengthMPa',
    'tensileStrengthMPa',
    'uniformElongationPct',
    'elongationAfterFracturePct',
  ] as const
  return keys.every((key) => closeTo(a[key], b[key], 1e-6))
}

describe('the way a record is written', () => {
  const plain = analyseRecord(writeRecord(base, PLAIN_FORMAT))

  it('does not change results: column order, units, separators and decimal marks', () => {
    fc.assert(
      fc.property(formatArbitrary, (format) => {
        // A comma cannot be both the separator and the decimal mark.
        fc.pre(!(format.delimiter === ',' && format.decimal === ','))
        return sameResults(analyseRecord(writeRecord(base, format)), plain)
      }),
      { numRuns: 20 },
    )
  })
})

// Toe compensation (ASTM E8/E8M) moves the strain origin to where the elastic line meets zero
// stress, so slack before the linear part must not move Rp0.2.
describe('a toe region', () => {
  it('does not change Rp0.2 after compensation', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.0001, max: 0.003, noNaN: true }),
        fc.double({ min: 10, max: 60, noNaN: true }),
        (shift, toeStress) => {
          const toed = analyseCurve(engineering(withToe(base, shift, toeStress)))
          return closeTo(toed.yieldStrengthMPa, reference.yieldStrengthMPa, 0.001)
        },
      ),
      { numRuns: 25 },
    )
  })
})
