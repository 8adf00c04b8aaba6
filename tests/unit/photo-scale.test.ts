import { describe, expect, it } from 'vitest'
import { calibrate, formatLength, pixelDistance, scaleBar } from '../../shared/photos/scale'

describe('calibrating a photo', () => {
  it('divides the known length by the line’s length (3-4-5 right triangle, Euclid I.47)', () => {
    expect(pixelDistance({ x: 10, y: 20 }, { x: 310, y: 420 })).toBe(500)
    expect(calibrate({ x: 10, y: 20 }, { x: 310, y: 420 }, 1000)).toBe(2)
  })

  it('refuses a line of no length or a length of zero', () => {
    expect(() => calibrate({ x: 1, y: 1 }, { x: 1, y: 1 }, 10)).toThrow(RangeError)
    expect(() => calibrate({ x: 0, y: 0 }, { x: 3, y: 4 }, 0)).toThrow(RangeError)
  })
})

describe('scale bars', () => {
  // The bar is the largest length of the 1-2-5 series (common practice on micrographs) that
  // spans no more than a fifth of the width; each expectation below is worked by hand.
  const cases: [number, number, number, string][] = [
    // µm per px, width px → bar µm, label
    [0.5, 2000, 200, '200 µm'], // fifth = 200 µm exactly
    [1, 2048, 200, '200 µm'], // fifth = 409.6 µm → 200
    [12.5, 4000, 10_000, '10 mm'], // fifth = 10 000 µm exactly
    [0.013, 1024, 2, '2 µm'], // fifth = 2.66 µm → 2
    [0.0009, 1000, 0.1, '100 nm'], // fifth = 0.18 µm → 0.1 µm
    [3, 1000, 500, '500 µm'], // fifth = 600 µm → 500
  ]
  for (const [perPixel, width, micrometres, label] of cases) {
    it(`${perPixel} µm/px over ${width} px → ${label}`, () => {
      const bar = scaleBar(perPixel, width)
      expect(bar.micrometres).toBeCloseTo(micrometres, 9)
      expect(bar.pixels).toBeCloseTo(micrometres / perPixel, 6)
      expect(bar.label).toBe(label)
    })
  }

  it('writes lengths in the unit that keeps the number between 1 and 1000 (SI prefixes)', () => {
    expect(formatLength(1500)).toBe('1.5 mm')
    expect(formatLength(2_500_000)).toBe('2.5 m')
    expect(formatLength(0.25)).toBe('250 nm')
    expect(formatLength(12.34)).toBe('12.3 µm')
  })
})
