import { describe, expect, it } from 'vitest'
import { analyseCurve, type EngineeringCurve } from '../../../shared/tensile'
import {
  hollomonCurve,
  rambergOsgoodCurve,
  yieldPointCurve,
  type YieldPointSpec,
} from '../../helpers/tensile/curves'
import { STRUCTURAL_STEEL } from '../../helpers/tensile/specimens'

function engineering(curve: { strain: number[]; stressMPa: number[] }): EngineeringCurve {
  return {
    strain: Float64Array.from(curve.strain),
    stress: Float64Array.from(curve.stressMPa),
    geometry: {
      areaMm2: 78.54,
      diameterMm: 10,
      extensometerGaugeLengthMm: 50,
      originalGaugeLengthMm: 50,
      finalGaugeLengthMm: null,
      finalAreaMm2: null,
    },
  }
}

const relative = (value: number | null, expected: number) =>
  Math.abs((value ?? Number.NaN) / expected - 1)

// Reference: the curves are built from known pieces (tests/helpers/tensile/curves.ts): ReH is
// the peak of the elastic line, ReL the lowest trough after the initial transient (ISO 6892-1
// ignores the transient), and Ae runs from ReH to where hardening starts abruptly.
const MILD_STEEL: YieldPointSpec = {
  modulusMPa: 205_000,
  upperYieldMPa: 318,
  transientMPa: 281,
  plateauHighs: [297, 299, 296, 298, 300, 297],
  plateauLows: [290, 288, 292, 286.5, 291, 293],
  plateauEndStrain: 0.021,
  rmMPa: 430,
  strainAtRm: 0.2,
  fractureStrain: 0.3,
}

describe('discontinuous yielding', () => {
  const result = analyseCurve(engineering(yieldPointCurve(MILD_STEEL)))
  const yieldStrain = MILD_STEEL.upperYieldMPa / MILD_STEEL.modulusMPa

  it('is detected, with ReH and ReL within 0.5 %', () => {
    expect(result.discontinuousYielding).toBe(true)
    expect(relative(result.upperYieldMPa, 318)).toBeLessThan(0.005)
    expect(relative(result.lowerYieldMPa, 286.5)).toBeLessThan(0.005)
  })

  it('gives the yield-point elongation within 0.2 percentage points', () => {
    const expected = (MILD_STEEL.plateauEndStrain - yieldStrain) * 100
    expect(Math.abs((result.yieldPointElongationPct ?? Number.NaN) - expected)).toBeLessThan(0.2)
  })

  it('still reports Rp0.2', () => {
    expect(result.yieldStrengthMPa).not.toBeNull()
  })

  it('is not reported for a continuous Ramberg–Osgood curve', () => {
    const continuous = rambergOsgoodCurve(STRUCTURAL_STEEL)
    const plain = analyseCurve(engineering(continuous))
    expect(plain.discontinuousYielding).toBe(false)
    expect(plain.upperYieldMPa).toBeNull()
  })
})

// Reference: Hollomon (1945) σ = K εⁿ; with it, maximum force falls at true strain n
// (Considère criterion). ASTM E646 fits log σ on log ε.
describe.each([
  [0.22, 530],
  [0.12, 900],
])('strain hardening of a Hollomon curve with n = %s, K = %s MPa', (n, k) => {
  const result = analyseCurve(engineering(hollomonCurve(200_000, k, n, 3000)))

  it('recovers n within 0.01 and K within 1 %', () => {
    expect(Math.abs((result.strainHardeningExponent ?? Number.NaN) - n)).toBeLessThan(0.01)
    expect(relative(result.strengthCoefficientMPa, k)).toBeLessThan(0.01)
    expect(result.hardeningFit?.points).toBeGreaterThanOrEqual(5)
  })

  it('puts maximum force at true strain n (Considère)', () => {
    expect(Math.abs(result.trueStrainAtMaxForce - n)).toBeLessThan(0.005)
  })

  it('fits from 10 % when Ag exceeds 12 %, else from 2 %', () => {
    expect(result.hardeningFit?.fromPct).toBe(result.uniformElongationPct > 12 ? 10 : 2)
  })
})

describe('proof strength at total extension', () => {
  it('gives Rt0.5 on the Ramberg–Osgood curve where ε = 0.5 %', () => {
    // Reference: solve σ/E + 0.002 (σ/σ0)^n = 0.005 for σ by bisection (the curve is monotonic).
    const spec = STRUCTURAL_STEEL
    let low = 0
    let high = 2 * spec.sigma0MPa
    for (let i = 0; i < 80; i++) {
      const mid = (low + high) / 2
      if (mid / spec.modulusMPa + 0.002 * (mid / spec.sigma0MPa) ** spec.n < 0.005) low = mid
      else high = mid
    }
    const result = analyseCurve(engineering(rambergOsgoodCurve(spec)))
    expect(relative(result.rt05MPa, low)).toBeLessThan(0.005)
  })
})
