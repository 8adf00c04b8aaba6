import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { convertSteelHardness } from '../../shared/hardness/convert'

// Reference pairs from ASTM E140 Table 1 (non-austenitic steels), typed from memory: the same
// source as the table under test, so these checks catch typing and interpolation slips, not
// errors in the recalled values themselves.
describe('steel hardness conversion (ASTM E140 Table 1, from memory)', () => {
  it.each([
    [50, 'HRC', { HV: 513, HBW: 481 }],
    [30, 'HRC', { HV: 302, HBW: 286 }],
    [20, 'HRC', { HV: 238, HBW: 226 }],
  ] as const)('%s %s converts to the table row', (value, scale, expected) => {
    expect(convertSteelHardness(value, scale)).toMatchObject({ HRC: value, ...expected })
  })

  it('goes both ways: Vickers back to Rockwell C and Brinell', () => {
    expect(convertSteelHardness(392, 'HV')).toMatchObject({ HRC: 40, HBW: 371 })
    expect(convertSteelHardness(421, 'HBW')).toMatchObject({ HRC: 45, HV: 446 })
  })

  it('interpolates linearly between rows and rounds as the table prints', () => {
    // halfway between HRC 40 (392 HV) and 41 (402 HV)
    expect(convertSteelHardness(397, 'HV').HRC).toBe(40.5)
    expect(convertSteelHardness(40.5, 'HRC').HV).toBe(397)
  })

  it('gives no Brinell above 615 HBW and says why', () => {
    const hard = convertSteelHardness(62, 'HRC')
    expect(hard).toMatchObject({ HV: 746, HBW: null, tensileMPa: null })
    expect(hard.notes.join(' ')).toMatch(/Brinell is not given/)
  })

  it('refuses to guess outside the table or from a scale without a table', () => {
    expect(convertSteelHardness(15, 'HRC')).toMatchObject({ HV: null, HBW: null })
    expect(convertSteelHardness(90, 'HRB').notes).toEqual(['No conversion from HRB is offered.'])
  })

  // Rm ≈ 3.45 × HBW for carbon and low-alloy steels: common practice, from memory.
  it('estimates tensile strength from Brinell up to 450 HBW, naming the relation', () => {
    const estimate = convertSteelHardness(30, 'HRC')
    expect(estimate.tensileMPa).toBe(985) // 3.45 × 286 = 986.7, to 5 MPa
    expect(estimate.sources.join(' ')).toMatch(/ASTM A370/)
    expect(convertSteelHardness(50, 'HRC').tensileMPa).toBeNull()
  })

  it('keeps every scale rising together across the whole table', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 67.9, noNaN: true }), (hrc) => {
        const lower = convertSteelHardness(hrc, 'HRC')
        const higher = convertSteelHardness(hrc + 0.1, 'HRC')
        expect(higher.HV!).toBeGreaterThanOrEqual(lower.HV!)
      }),
    )
  })
})
