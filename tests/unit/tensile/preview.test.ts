import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { analyseSpecimens, previewRecord, thinCurve } from '../../../shared/tensile'

// Open 42CrMoS4 record (CC BY 4.0, see tests/fixtures/tensile-42CrMoS4/README.md): tab-separated,
// a preamble, a header row and a units row.
const text = readFileSync('tests/fixtures/tensile-42CrMoS4/46NT73.csv', 'utf8')

describe('upload preview', () => {
  it('shows the dialect, headings, preamble and the same result the pipeline gives', () => {
    const options = { spec: '42CrMo4+QT' }
    const preview = previewRecord('46NT73.csv', text, options)
    expect(preview.problem).toBeNull()
    expect(preview.dialect).toEqual({ delimiter: '\t', decimal: '.' })
    expect(preview.headings.map((h) => h.name)).toContain('Force')
    expect(preview.headings.find((h) => h.name === 'Force')?.unit).toBe('kN')
    expect(preview.preamble.find((row) => row[0] === 'Specimen ID:')?.[1]).toBe('46NT73')
    expect(preview.firstRows[0]?.startsWith('0\t')).toBe(true)
    expect(preview.result).toEqual(
      analyseSpecimens([{ name: '46NT73.csv', source: text }], options),
    )
  })

  it('follows a corrected mapping and reports the engine’s refusal in its words', () => {
    const corrected = previewRecord('46NT73.csv', text, { forceColumn: 'Force' })
    expect(corrected.usedColumns.find((c) => c.role === 'force')?.name).toBe('Force')
    const wrong = previewRecord('46NT73.csv', text, { forceColumn: 'No such column' })
    expect(wrong.problem).toMatch(/^46NT73\.csv: /)
    expect(wrong.result).toBeNull()
    expect(previewRecord('x.csv', text, { fitRange: 'soon' }).problem).toMatch(/^fitRange/)
  })

  it('thins a long curve for display but keeps its highest stress', () => {
    // An analytic curve: stress = 1000·(1 − e^(−strain·50)) with a dip, 200 000 points.
    const n = 200_000
    const strain = Float64Array.from({ length: n }, (_, i) => (i / n) * 0.2)
    const stress = strain.map((e, i) => 1000 * (1 - Math.exp(-e * 50)) - (i === 150_001 ? 300 : 0))
    const points = thinCurve(strain, stress, 1500)
    expect(points.length).toBeLessThanOrEqual(1600)
    expect(Math.max(...points.map((p) => p.y))).toBe(stress.reduce((a, b) => Math.max(a, b)))
    expect(Math.min(...points.slice(1).map((p) => p.y))).toBeLessThan(stress[150_000]! - 200)
  })
})
