import { describe, expect, it } from 'vitest'
import { roundToIncrement } from '../../../shared/tensile'

// ASTM E29 rounding method (recalled from memory): round to the nearest multiple of the
// increment; an exact half goes to the even multiple.
describe('reporting rounding', () => {
  it('rounds strengths to 1 MPa and elongations to 0.5 %', () => {
    expect(roundToIncrement(1132.49, 1)).toBe(1132)
    expect(roundToIncrement(1132.51, 1)).toBe(1133)
    expect(roundToIncrement(14.74, 0.5)).toBe(14.5)
    expect(roundToIncrement(14.76, 0.5)).toBe(15)
  })

  it('sends exact halves to the even multiple', () => {
    expect(roundToIncrement(1132.5, 1)).toBe(1132)
    expect(roundToIncrement(1133.5, 1)).toBe(1134)
    expect(roundToIncrement(14.25, 0.5)).toBe(14)
    expect(roundToIncrement(14.75, 0.5)).toBe(15)
    expect(roundToIncrement(-2.5, 1)).toBe(-2)
  })
})
