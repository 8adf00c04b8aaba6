import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { describe, expect, it, vi } from 'vitest'
import { MPA_PER_KSI } from '../../../shared/tensile'
import { rambergOsgoodCurve, withToe } from '../../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord } from '../../helpers/tensile/dialects'
import { CLI_TEST_TIMEOUT_MS, runAnalyze } from '../../helpers/tensile/run-cli'
import { TEMPERED_STEEL } from '../../helpers/tensile/specimens'

vi.setConfig({ testTimeout: CLI_TEST_TIMEOUT_MS })

const directory = mkdtempSync(path.join(tmpdir(), 'fractolog-cli-'))
const curve = withToe(rambergOsgoodCurve(TEMPERED_STEEL), 0.0005, 100)
const semicolonFile = path.join(directory, 'semicolon.csv')
writeFileSync(
  semicolonFile,
  writeRecord(curve, {
    ...PLAIN_FORMAT,
    delimiter: ';',
    decimal: ',',
    forceUnit: 'kN',
    preamble: false,
  }),
)

// Reference: Ramberg–Osgood (NACA TN 902, Hill NACA TN 927): Rp0.2 = σ0 exactly.
describe('command-line entry on a fresh curve', () => {
  it('prints one JSON object in SI with the contract keys', () => {
    const run = runAnalyze([semicolonFile, '--diameter', '10mm', '--gauge-length', '50', '--json'])
    expect(run.status).toBe(0)
    const result = JSON.parse(run.stdout) as Record<string, unknown>
    for (const key of [
      'modulusGPa',
      'modulusFit',
      'proportionalLimitMPa',
      'offsetPct',
      'yieldStrengthMPa',
      'tensileStrengthMPa',
      'uniformElongationPct',
      'totalElongationAtMaxForcePct',
      'fractureStrengthMPa',
      'elongationAfterFracturePct',
      'elongationAfterFractureFromLuPct',
      'reductionOfAreaPct',
      'resilienceMJm3',
      'toughnessMJm3',
      'points',
      'warnings',
    ]) {
      expect(result).toHaveProperty(key)
    }
    expect(Math.abs(Number(result.yieldStrengthMPa) / TEMPERED_STEEL.sigma0MPa - 1)).toBeLessThan(
      0.005,
    )
    expect(result.reductionOfAreaPct).toBeNull()
  })

  it('takes geometry in inches and reports Z and A from final dimensions', () => {
    const run = runAnalyze([
      semicolonFile,
      '--diameter',
      '0.39370078740157477in',
      '--gauge-length',
      '50mm',
      '--final-diameter',
      '7mm',
      '--final-gauge-length',
      '56mm',
      '--json',
    ])
    const result = JSON.parse(run.stdout) as Record<string, number>
    // Z = (S0 − Su)/S0 = 1 − (7/10)² and A = (Lu − L0)/L0 = 6/50 (ISO 6892-1 definitions).
    expect(result.reductionOfAreaPct).toBeCloseTo(51, 9)
    expect(result.elongationAfterFractureFromLuPct).toBeCloseTo(12, 9)
  })

  it('prints a rounded table in US customary units on request', () => {
    const run = runAnalyze([
      semicolonFile,
      '--diameter',
      '10',
      '--gauge-length',
      '50',
      '--units',
      'us',
    ])
    expect(run.status).toBe(0)
    const shown = Number(/Rp0\.2\s+([\d.]+) ksi/.exec(run.stdout)?.[1])
    // 1 ksi = 6.894757293168361 MPa exactly (NIST SP 811); table rounded to 0.1 ksi.
    expect(Math.abs(shown - TEMPERED_STEEL.sigma0MPa / MPA_PER_KSI)).toBeLessThan(
      0.005 * shown + 0.05,
    )
    expect(run.stdout).toMatch(/only as good as the specimen measurements/)
  })

  it('uses an elastic fit range given on the command line', () => {
    const run = runAnalyze([
      semicolonFile,
      '--diameter',
      '10',
      '--gauge-length',
      '50',
      '--fit-range',
      '200:600MPa',
      '--json',
    ])
    const fit = (JSON.parse(run.stdout) as { modulusFit: { fromMPa: number; toMPa: number } })
      .modulusFit
    expect(fit.fromMPa).toBeGreaterThanOrEqual(200)
    expect(fit.toMPa).toBeLessThanOrEqual(600)
  })
})
