import { describe, expect, it } from 'vitest'
import { analyseRecord, type TensileResult } from '../../../shared/tensile'
import {
  rambergOsgoodCurve,
  withStressNoise,
  withToe,
  type SyntheticCurve,
} from '../../helpers/tensile/curves'
import {
  PLAIN_FORMAT,
  SPECIMEN,
  writeRecord,
  type RecordFormat,
} from '../../helpers/tensile/dialects'
import { ALUMINIUM_ALLOY, STRUCTURAL_STEEL, TEMPERED_STEEL } from '../../helpers/tensile/specimens'

const relative = (value: number | null, expected: number) =>
  Math.abs((value ?? Number.NaN) / expected - 1)

const DIALECTS: Record<string, RecordFormat> = {
  'comma, point, N, mm, brackets, preamble': PLAIN_FORMAT,
  'semicolon, decimal comma, kN, units row, no preamble': {
    ...PLAIN_FORMAT,
    delimiter: ';',
    decimal: ',',
    forceUnit: 'kN',
    unitStyle: 'row',
    preamble: false,
    order: [3, 2, 0, 4, 1],
  },
  'tab, decimal comma, lbf, inches, parentheses': {
    ...PLAIN_FORMAT,
    delimiter: '\t',
    decimal: ',',
    forceUnit: 'lbf',
    lengthUnit: 'in',
    unitStyle: 'parentheses',
  },
  'tab, kgf, strain in percent, reordered': {
    ...PLAIN_FORMAT,
    delimiter: '\t',
    forceUnit: 'kgf',
    strainInPercent: true,
    order: [4, 3, 2, 1, 0],
  },
}

const GEOMETRY_OPTIONS = {
  geometry: {
    section: { diameterMm: SPECIMEN.diameterMm },
    extensometerGaugeLengthMm: SPECIMEN.gaugeLengthMm,
  },
}

function analyse(curve: SyntheticCurve, format: RecordFormat): TensileResult {
  return analyseRecord(writeRecord(curve, format), format.preamble ? {} : GEOMETRY_OPTIONS)
}

// Reference: the Ramberg–Osgood curve ε = σ/E + 0.002 (σ/σ0)^n (Ramberg & Osgood, NACA TN 902;
// offset form by Hill, NACA TN 927) has its 0.2 % offset yield at exactly σ0 and a plastic
// strain of 0.01 % at σ0 · 0.05^(1/n). Rm, Ag and A follow from how the curve was built.
function expectAnalyticProperties(result: TensileResult, curve: SyntheticCurve): void {
  const x = curve.expected
  expect(relative(result.modulusGPa * 1000, x.modulusMPa)).toBeLessThan(0.01)
  expect(relative(result.yieldStrengthMPa, x.rp02MPa)).toBeLessThan(0.005)
  expect(relative(result.tensileStrengthMPa, x.rmMPa)).toBeLessThan(0.005)
  expect(relative(result.proportionalLimitMPa, x.proportionalLimitMPa)).toBeLessThan(0.02)
  expect(Math.abs(result.uniformElongationPct - x.agPct)).toBeLessThan(0.2)
  expect(Math.abs(result.elongationAfterFracturePct - x.aPct)).toBeLessThan(0.2)
}

describe.each([
  ['structural steel', STRUCTURAL_STEEL],
  ['aluminium alloy', ALUMINIUM_ALLOY],
  ['tempered steel', TEMPERED_STEEL],
])('Ramberg–Osgood curve of a %s', (_name, spec) => {
  const clean = rambergOsgoodCurve(spec)
  const toed = withToe(clean, 0.0008, 0.1 * spec.sigma0MPa)

  it.each(Object.entries(DIALECTS))(
    'reproduces E, Rp0.2, Rm, proportional limit, Ag and A (%s)',
    (_d, format) => {
      expectAnalyticProperties(analyse(clean, format), clean)
    },
  )

  it('reproduces them after toe compensation when the record starts with slack', () => {
    const result = analyse(toed, PLAIN_FORMAT)
    expectAnalyticProperties(result, toed)
    expect(result.strainOriginShiftPct).toBeCloseTo(0.08, 2)
  })

  it('keeps Rp0.2 within 1 %, Rm within 0.5 % and E within 3 % with noise of 0.1 % of Rm', () => {
    const noisy = withStressNoise(toed, 0.001, 20240611)
    const result = analyse(noisy, PLAIN_FORMAT)
    expect(relative(result.yieldStrengthMPa, spec.sigma0MPa)).toBeLessThan(0.01)
    expect(relative(result.tensileStrengthMPa, noisy.expected.rmMPa)).toBeLessThan(0.005)
    expect(relative(result.modulusGPa * 1000, spec.modulusMPa)).toBeLessThan(0.03)
  })
})

describe('elastic fit range given by the user', () => {
  it('uses only the samples in the stress range and reports it', () => {
    const curve = rambergOsgoodCurve(STRUCTURAL_STEEL)
    const result = analyseRecord(writeRecord(curve, PLAIN_FORMAT), {
      fitRange: { quantity: 'stress', fromMPa: 50, toMPa: 150 },
    })
    expect(result.modulusFit.fromMPa).toBeGreaterThanOrEqual(50)
    expect(result.modulusFit.toMPa).toBeLessThanOrEqual(150)
    // Below 150 MPa the Ramberg–Osgood plastic term is under 1e-7: the slope is E.
    expect(relative(result.modulusGPa * 1000, STRUCTURAL_STEEL.modulusMPa)).toBeLessThan(0.001)
  })
})

describe('derived properties', () => {
  const curve = rambergOsgoodCurve(STRUCTURAL_STEEL)
  const result = analyse(curve, PLAIN_FORMAT)

  it('gives the modulus of resilience as Rp²/(2E)', () => {
    const rp = result.yieldStrengthMPa ?? Number.NaN
    expect(result.resilienceMJm3).toBeCloseTo((rp * rp) / (2 * result.modulusGPa * 1000), 10)
  })

  it('integrates the toughness to within 0.5 % of the analytic area', () => {
    // Area under the built curve by fine trapezoids on the generator's own samples.
    let area = 0
    for (
      let i = 1;
      i < curve.strain.length && curve.strain[i]! <= STRUCTURAL_STEEL.fractureStrain;
      i++
    ) {
      area +=
        ((curve.stressMPa[i]! + curve.stressMPa[i - 1]!) / 2) *
        (curve.strain[i]! - curve.strain[i - 1]!)
    }
    expect(relative(result.toughnessMJm3, area)).toBeLessThan(0.005)
  })

  it('gives true stress σ(1 + ε) and true strain ln(1 + ε) at maximum force', () => {
    const e = result.totalElongationAtMaxForcePct / 100
    expect(result.trueStressAtMaxForceMPa).toBeCloseTo(result.tensileStrengthMPa * (1 + e), 6)
    expect(result.trueStrainAtMaxForce).toBeCloseTo(Math.log(1 + e), 9)
  })
})
