import path from 'node:path'
import { describe, expect, it, vi } from 'vitest'
import { closingCaution, MPA_PER_KSI, PROPERTY_CATALOGUE } from '../../../shared/tensile'
import { labValues, OPEN_RECORDS_DIR } from '../../helpers/tensile/open-records'
import { CLI_TEST_TIMEOUT_MS, runAnalyze } from '../../helpers/tensile/run-cli'

vi.setConfig({ testTimeout: CLI_TEST_TIMEOUT_MS })

const files = ['46NT71.csv', '46NT73.csv'].map((f) => path.join(OPEN_RECORDS_DIR, f))

describe('the closing caution', () => {
  const spec = { designation: 'S355J2', standard: 'EN 10025-2', source: 'recalled from memory' }

  it('names the edition the contract cites', () => {
    const text = closingCaution({ ...spec, edition: '2019' })
    expect(text).toMatch(/EN 10025-2, edition 2019, the edition the contract or the client’s/)
    expect(text).not.toMatch(/current edition/)
  })

  it('asks for the edition when none was named', () => {
    const text = closingCaution({ ...spec, edition: null })
    expect(text).toMatch(/no edition of EN 10025-2 was named/)
    expect(text).not.toMatch(/current edition/)
  })

  it('defers to the codes and to competent, authorised professionals', () => {
    expect(closingCaution(null)).toMatch(
      /applicable codes.*judgment of competent, authorised .*professionals/,
    )
  })
})

describe('labels from the one catalogue', () => {
  it('calls toughness tensile toughness, the energy to fracture', () => {
    const toughness = PROPERTY_CATALOGUE.find((p) => p.key === 'toughnessMJm3')
    expect(toughness?.label).toBe('Tensile toughness (energy to fracture)')
  })
})

describe('the readable report', () => {
  const run = runAnalyze([
    ...files,
    '--spec',
    '42CrMo4+QT',
    '--spec-edition',
    '2016',
    '--units',
    'us',
  ])
  const summary = run.stdout.slice(run.stdout.indexOf('Summary of 2 specimens'))

  it('labels the summary like the per-specimen table, in the units asked for', () => {
    expect(run.status).toBe(0)
    expect(summary).toMatch(/Tensile strength Rm\s+mean [\d.]+ ksi/)
    expect(summary).toMatch(/Tensile toughness \(energy to fracture\)\s+mean/)
    expect(summary).not.toMatch(/tensileStrengthMPa|MPa/)
  })

  it('gives the summary’s mean Rm in ksi (1 ksi = 6.894757293168361 MPa, NIST SP 811)', () => {
    // The originating lab's Rm of the two records (their preambles), averaged.
    const labMean = (labValues('46NT71.csv').rm + labValues('46NT73.csv').rm) / 2
    const shown = Number(/Tensile strength Rm\s+mean ([\d.]+) ksi/.exec(summary)?.[1])
    expect(Math.abs(shown - labMean / MPA_PER_KSI)).toBeLessThan(0.005 * shown)
  })

  it('puts the indicative caution beside every verdict and the edition in the closing caution', () => {
    const verdicts = run.stdout.match(/Conformity with .*: (pass|fail|inconclusive|incomplete)/g)
    const cautions = run.stdout.match(/Indicative only: specimens cut from a failed part/g)
    expect(verdicts).toHaveLength(2)
    expect(cautions).toHaveLength(2)
    expect(run.stdout).toMatch(/EN 10083-3, edition 2016, the edition the contract/)
  })
})
