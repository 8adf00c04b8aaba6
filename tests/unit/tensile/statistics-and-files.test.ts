import path from 'node:path'
import { describe, expect, it, vi } from 'vitest'
import { summariseValues } from '../../../shared/tensile'
import { OPEN_RECORDS_DIR } from '../../helpers/tensile/open-records'
import { CLI_TEST_TIMEOUT_MS, runAnalyze } from '../../helpers/tensile/run-cli'

vi.setConfig({ testTimeout: CLI_TEST_TIMEOUT_MS })

// Reference: the sample mean and the sample standard deviation with n − 1 in the denominator
// (the usual definition; for 1, 2, 3, 4 it is √(5/3)).
describe('statistics over several specimens', () => {
  it('gives mean, standard deviation, min and max', () => {
    const summary = summariseValues([1, 2, 3, 4])
    expect(summary?.mean).toBe(2.5)
    expect(summary?.standardDeviation).toBeCloseTo(Math.sqrt(5 / 3), 12)
    expect(summary?.min).toBe(1)
    expect(summary?.max).toBe(4)
  })

  it('has no standard deviation for a single specimen', () => {
    expect(summariseValues([7])?.standardDeviation).toBeNull()
  })
})

describe('several files and specifications on the command line', () => {
  const files = ['46NT71.csv', '46NT73.csv', '46NT75.csv'].map((f) =>
    path.join(OPEN_RECORDS_DIR, f),
  )

  it('prints one object per file and a summary as a JSON array', () => {
    const run = runAnalyze([...files, '--json', '--spec', '42CrMo4+QT'])
    expect(run.status).toBe(0)
    const output = JSON.parse(run.stdout) as Record<string, unknown>[]
    expect(output).toHaveLength(4)
    const summary = output[3]?.summary as {
      specimens: number
      properties: Record<string, { mean: number; count: number }>
    }
    expect(summary.specimens).toBe(3)
    const rms = output.slice(0, 3).map((entry) => Number(entry.tensileStrengthMPa))
    expect(summary.properties.tensileStrengthMPa?.mean).toBeCloseTo(
      (rms[0]! + rms[1]! + rms[2]!) / 3,
      9,
    )
    expect((output[0]?.conformity as { overall: string }).overall).toBe('pass')
  })

  it('lists the starter specifications', () => {
    const run = runAnalyze(['--spec', 'list'])
    expect(run.status).toBe(0)
    expect(run.stdout).toMatch(/S355J2\s+EN 10025-2/)
  })

  it('refuses a guard-band rule without an uncertainty', () => {
    const run = runAnalyze([files[0]!, '--spec', 'S355J2', '--rule', 'guard'])
    expect(run.status).toBe(2)
    expect(run.stderr.trim().split('\n')).toHaveLength(1)
    expect(run.stdout).toBe('')
  })
})
