import { describe, expect, it } from 'vitest'
import { analyseRecord, type TensileResult } from '../../../shared/tensile'
import { rambergOsgoodCurve, withStressNoise, withToe } from '../../helpers/tensile/curves'
import {
  PLAIN_FORMAT,
  SPECIMEN,
  writeRecord,
  type RecordFormat,
} from '../../helpers/tensile/dialects'
import {
  ALUMINIUM_ALLOY,
  ROUNDED_ALUMINIUM,
  ROUNDED_STAINLESS,
} from '../../helpers/tensile/specimens'

// Reference: the Ramberg–Osgood curve ε = σ/E + 0.002 (σ/σ0)^n (Ramberg & Osgood, NACA TN 902;
// Hill, NACA TN 927) has no straight part at all: its slope at the origin is E, and its 0.2 %
// offset yield is exactly σ0. With n from 5 to 10 it stands for austenitic stainless steels
// and many aluminium alloys, whose linear part has no sharp end.
const relative = (value: number | null, expected: number) =>
  Math.abs((value ?? Number.NaN) / expected - 1)

const DIALECTS: Record<string, RecordFormat> = {
  'comma, point, N, mm, preamble': PLAIN_FORMAT,
  'semicolon, decimal comma, kN, units row': {
    ...PLAIN_FORMAT,
    delimiter: ';',
    decimal: ',',
    forceUnit: 'kN',
    unitStyle: 'row',
    preamble: false,
    order: [3, 2, 0, 4, 1],
  },
  'tab, lbf, inches, parentheses': {
    ...PLAIN_FORMAT,
    delimiter: '\t',
    forceUnit: 'lbf',
    lengthUnit: 'in',
    unitStyle: 'parentheses',
  },
  'tab, kgf, strain in percent': {
    ...PLAIN_FORMAT,
    delimiter: '\t',
    forceUnit: 'kgf',
    strainInPercent: true,
  },
}

const GEOMETRY = {
  geometry: {
    section: { diameterMm: SPECIMEN.diameterMm },
    extensometerGaugeLengthMm: SPECIMEN.gaugeLengthMm,
  },
}

function analyse(text: string, format: RecordFormat): TensileResult {
  return analyseRecord(text, format.preamble ? {} : GEOMETRY)
}

describe.each([
  ['an austenitic stainless steel', ROUNDED_STAINLESS],
  ['an aluminium alloy', ROUNDED_ALUMINIUM],
])('rounded Ramberg–Osgood curve of %s', (_name, material) => {
  describe.each([5, 6, 8, 10])('with n = %i', (n) => {
    const spec = { ...material, n }
    const curve = rambergOsgoodCurve(spec)

    it.each(Object.entries(DIALECTS))(
      'gives E within 2 % and Rp0.2 within 1 % (%s)',
      (_d, format) => {
        const result = analyse(writeRecord(curve, format), format)
        expect(relative(result.modulusGPa * 1000, spec.modulusMPa)).toBeLessThan(0.02)
        expect(relative(result.yieldStrengthMPa, spec.sigma0MPa)).toBeLessThan(0.01)
      },
    )

    it('keeps them after toe compensation when the record starts with slack', () => {
      const toed = withToe(curve, 0.0008, 0.1 * spec.sigma0MPa)
      const result = analyse(writeRecord(toed, PLAIN_FORMAT), PLAIN_FORMAT)
      expect(relative(result.modulusGPa * 1000, spec.modulusMPa)).toBeLessThan(0.02)
      expect(relative(result.yieldStrengthMPa, spec.sigma0MPa)).toBeLessThan(0.01)
    })

    it('keeps Rp0.2 within 1 % with a toe and noise of 0.1 % of Rm', () => {
      const noisy = withStressNoise(withToe(curve, 0.0008, 0.1 * spec.sigma0MPa), 0.001, 1902 + n)
      const result = analyse(writeRecord(noisy, PLAIN_FORMAT), PLAIN_FORMAT)
      expect(relative(result.yieldStrengthMPa, spec.sigma0MPa)).toBeLessThan(0.01)
    })
  })
})

describe('the elastic window is reported', () => {
  it('as found automatically, on the straight start of a rounded curve, with a warning', () => {
    const result = analyseRecord(
      writeRecord(rambergOsgoodCurve({ ...ROUNDED_STAINLESS, n: 5 }), PLAIN_FORMAT),
    )
    const fit = result.modulusFit
    expect(fit).toMatchObject({ chosenBy: 'automatic', rounded: true })
    expect(fit.toMPa).toBeLessThan(0.5 * ROUNDED_STAINLESS.sigma0MPa)
    // The recorded strain at the window's ends is σ/E + 0.002 (σ/σ0)^n at its stresses.
    const strainAt = (s: number) =>
      (s / ROUNDED_STAINLESS.modulusMPa + 0.002 * (s / ROUNDED_STAINLESS.sigma0MPa) ** 5) * 100
    expect(fit.toStrainPct).toBeCloseTo(strainAt(fit.toMPa), 6)
    expect(fit.toPoint - fit.fromPoint + 1).toBe(fit.points)
    expect(result.warnings.join(' ')).toMatch(/No sharp end to the linear part/)
  })

  it('as not rounded on a sharp curve (n = 25)', () => {
    const result = analyseRecord(writeRecord(rambergOsgoodCurve(ALUMINIUM_ALLOY), PLAIN_FORMAT))
    expect(result.modulusFit).toMatchObject({ chosenBy: 'automatic', rounded: false })
    expect(result.warnings).toEqual([])
  })

  it('as given when the fit range was set', () => {
    const curve = rambergOsgoodCurve({ ...ROUNDED_ALUMINIUM, n: 6 })
    const result = analyseRecord(writeRecord(curve, PLAIN_FORMAT), {
      fitRange: { quantity: 'stress', fromMPa: 10, toMPa: 60 },
    })
    expect(result.modulusFit).toMatchObject({ chosenBy: 'fit range', rounded: false })
    expect(result.modulusFit.fromMPa).toBeGreaterThanOrEqual(10)
  })
})
