import { describe, expect, it } from 'vitest'
import {
  MPA_PER_KSI,
  MPA_PER_PSI,
  parseQuantity,
  unitFactor,
  TensileInputError,
} from '../../../shared/tensile'

// Exact definitions from NIST SP 811 (2008), appendix B: 1 in = 0.0254 m exactly;
// 1 lbf = 4.4482216152605 N exactly (0.45359237 kg × 9.80665 m/s²); 1 kgf = 9.80665 N exactly.
describe('unit conversions follow their exact definitions (NIST SP 811)', () => {
  it('converts lengths and areas from inches', () => {
    expect(unitFactor('in', 'length')).toBe(25.4)
    expect(unitFactor('in2', 'area')).toBeCloseTo(645.16, 12) // 25.4² exactly
  })

  it('converts forces from lbf, kgf and kN', () => {
    expect(unitFactor('lbf', 'force')).toBe(4.4482216152605)
    expect(unitFactor('kgf', 'force')).toBe(9.80665)
    expect(unitFactor('kN', 'force')).toBe(1000)
  })

  it('derives ksi and psi from lbf and in', () => {
    // NIST SP 811 B.8: 1 psi = 6.894757 kPa (rounded there); exact from lbf/in².
    expect(MPA_PER_PSI).toBeCloseTo(4.4482216152605 / 645.16, 15)
    expect(MPA_PER_KSI).toBeCloseTo(6.894757293168361, 12)
    expect(unitFactor('ksi', 'stress')).toBe(MPA_PER_KSI)
  })

  it('reads strain units as fractions', () => {
    expect(unitFactor('%', 'strain')).toBe(0.01)
    expect(unitFactor('mm/mm', 'strain')).toBe(1)
    expect(unitFactor('', 'strain')).toBe(1) // an empty unit cell means dimensionless
  })
})

describe('quantities written on the command line', () => {
  it('takes a bare number as mm or mm²', () => {
    expect(parseQuantity('12.5', 'length', 'mm')).toBe(12.5)
    expect(parseQuantity('37.5', 'area', 'mm2')).toBe(37.5)
  })

  it('converts inches and square inches exactly', () => {
    expect(parseQuantity('0.5in', 'length', 'mm')).toBeCloseTo(12.7, 12)
    expect(parseQuantity('0.2 in2', 'area', 'mm2')).toBeCloseTo(129.032, 10)
  })

  it('rejects units it does not know, naming them', () => {
    expect(() => parseQuantity('3furlong', 'length', 'mm')).toThrow(TensileInputError)
    expect(() => parseQuantity('3furlong', 'length', 'mm')).toThrow(/furlong/)
  })
})
