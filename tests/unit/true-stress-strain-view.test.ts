import { describe, expect, it } from 'vitest'
import { hollomonLine, trueCurve, type TrueCurveInput } from '../../shared/tensile/true-view'

// True stress σt = σ(1 + ε) and true strain εt = ln(1 + ε) (ASTM E646, terms; also any
// mechanics-of-materials text). A Hollomon material σt = K·εtⁿ reaches maximum force at εt = n
// (the Considère condition), which gives an analytic curve to check against.
const K = 900
const N = 0.15
const SHIFT = 0.05 // toe compensation, % strain

function hollomonEngineeringCurve() {
  const points = []
  for (let i = 1; i <= 400; i++) {
    const trueStrain = (0.3 * i) / 400
    const strain = Math.expm1(trueStrain)
    points.push({ x: strain * 100 + SHIFT, y: (K * trueStrain ** N) / (1 + strain) })
  }
  return points
}

const atMaxForce = Math.expm1(N) * 100
const result: TrueCurveInput = {
  strainOriginShiftPct: SHIFT,
  totalElongationAtMaxForcePct: atMaxForce,
  trueStressAtMaxForceMPa: K * N ** N,
  trueStrainAtMaxForce: N,
  strainHardeningExponent: N,
  strengthCoefficientMPa: K,
  hardeningFit: { fromPct: 2, toPct: 10, points: 100, rSquared: 1 },
}

describe('the true stress–strain view', () => {
  it('turns the engineering curve back into σ = K·εⁿ, stopping at maximum force', () => {
    const points = trueCurve(hollomonEngineeringCurve(), result)
    expect(points.length).toBeGreaterThan(100)
    for (const { x, y } of points) expect(y).toBeCloseTo(K * (x / 100) ** N, 6)
    expect(points.at(-1)!.x).toBeLessThanOrEqual(N * 100 + 1e-9)
    expect(points.at(-1)!.x).toBeGreaterThan(N * 100 - 0.2)
  })

  it('leaves out the toe before the strain origin', () => {
    const toe = [{ x: 0.01, y: 5 }, ...hollomonEngineeringCurve()]
    expect(trueCurve(toe, result).every((p) => p.x >= 0)).toBe(true)
  })

  it('draws the fitted Hollomon line over the fitted window only', () => {
    const line = hollomonLine(result)
    expect(line[0]!.x).toBeCloseTo(Math.log1p(0.02) * 100, 9)
    expect(line.at(-1)!.x).toBeCloseTo(Math.log1p(0.1) * 100, 9)
    expect(line[10]!.y).toBeCloseTo(K * (line[10]!.x / 100) ** N, 9)
    expect(hollomonLine({ ...result, strainHardeningExponent: null })).toEqual([])
  })
})
