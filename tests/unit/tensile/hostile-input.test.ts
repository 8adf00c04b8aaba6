import { truncateSync, mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { performance } from 'node:perf_hooks'
import { describe, expect, it, vi } from 'vitest'
import { importRecord, RECORD_LIMITS, type RecordChunks } from '../../../shared/tensile'
import { firstBracketed, splitTrailingUnit } from '../../../shared/tensile/brackets'
import {
  hollomonCurve,
  rambergOsgoodCurve,
  type SyntheticCurve,
} from '../../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord } from '../../helpers/tensile/dialects'
import { CLI_TEST_TIMEOUT_MS, runAnalyze } from '../../helpers/tensile/run-cli'
import { STRUCTURAL_STEEL } from '../../helpers/tensile/specimens'

vi.setConfig({ testTimeout: CLI_TEST_TIMEOUT_MS })

/*
 * Records from many people reach the server, so a crafted one must not stall it: every scan is
 * linear in its input, and lines, cells, columns and files have limits. Time bounds here are
 * generous (seconds for work that takes milliseconds): they catch a quadratic scan, which
 * takes minutes on these sizes, and time nothing else.
 */
const GENEROUS_MS = 5_000
const directory = mkdtempSync(path.join(tmpdir(), 'fractolog-hostile-'))
const good = writeRecord(rambergOsgoodCurve({ ...STRUCTURAL_STEEL, samples: 200 }), PLAIN_FORMAT)
const [preambleA, preambleB, preambleC, header, ...body] = good.split('\n')
const CONTROL = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/

function withHeader(newHeader: string): string {
  return [preambleA, preambleB, preambleC, newHeader, ...body].join('\n')
}

function file(name: string, text: string): string {
  const target = path.join(directory, name)
  writeFileSync(target, text)
  return target
}

function elapsed(work: () => unknown): number {
  const start = performance.now()
  try {
    work()
  } catch {
    // Refusing is as good as reading here; only the time is checked.
  }
  return performance.now() - start
}

function refusal(source: string | RecordChunks): string {
  try {
    importRecord(source)
  } catch (error) {
    return (error as Error).message
  }
  throw new Error('the record was accepted')
}

describe('bracketed units are found in time linear in the cell', () => {
  const million = 1_000_000
  it.each([
    ['repeated opening parentheses', '('.repeat(million)],
    ['repeated opening brackets then a close', `${'['.repeat(million)}]`],
    ['alternating brackets', '(['.repeat(million / 2)],
    ['a name, spaces and an unclosed bracket', `Force${' '.repeat(million)}(kN`],
  ])('%s', (_name, cell) => {
    expect(elapsed(() => splitTrailingUnit(cell))).toBeLessThan(GENEROUS_MS)
    expect(elapsed(() => firstBracketed(cell))).toBeLessThan(GENEROUS_MS)
  })

  it('still splits ordinary cells as a header writes them', () => {
    expect(splitTrailingUnit('Force [kN]')).toEqual(['Force', 'kN'])
    expect(splitTrailingUnit('Stress (true) [MPa]')).toEqual(['Stress (true)', 'MPa'])
    expect(splitTrailingUnit('Force')).toBeNull()
    expect(firstBracketed('Gauge length (mm):')).toBe('mm')
  })
})

describe('size limits, each refused with a clear message', () => {
  it('refuses a 100,000-character header cell quickly, naming the line', () => {
    const text = withHeader(`Time [s],${'('.repeat(100_000)},Force [N]`)
    let message = ''
    expect(elapsed(() => (message = refusal(text)))).toBeLessThan(GENEROUS_MS)
    expect(message).toBe('Line 4 is longer than 10,000 characters')
  })

  it('refuses a header cell longer than 1,000 characters in a line of ordinary length', () => {
    const cells = header!.split(',')
    cells[1] = `Crosshead ${'('.repeat(2_000)}`
    expect(refusal(withHeader(cells.join(',')))).toBe(
      'Line 4, column 2: a cell longer than 1,000 characters',
    )
  })

  it('refuses a row of more than 1,000 columns', () => {
    expect(refusal(withHeader(`${header},${'x,'.repeat(1_200)}`))).toBe(
      'Line 4 has more than 1,000 columns',
    )
  })

  it('refuses a line without an end before reading it all', () => {
    const endless: RecordChunks = {
      *[Symbol.iterator]() {
        for (let k = 0; k < 1_000; k++) yield 'x'.repeat(65_536)
        throw new Error('read past the limit')
      },
    }
    expect(refusal(endless)).toBe('Line 1 is longer than 10,000 characters')
  })

  it('refuses a record that says it is longer than the limit, before reading it', () => {
    const huge: RecordChunks = {
      characters: RECORD_LIMITS.characters + 1,
      [Symbol.iterator]: () => {
        throw new Error('read although too long')
      },
    }
    expect(refusal(huge)).toBe('The record is longer than 268,435,456 characters')
  })

  it('refuses more than 5,000,000 data points', () => {
    const million = '1,2\n'.repeat(1_000_000)
    const points: RecordChunks = {
      *[Symbol.iterator]() {
        yield 'Strain [%],Stress [MPa]\n'
        for (let k = 0; k < 6; k++) yield million
      },
    }
    expect(refusal(points)).toBe('The record holds more than 5,000,000 data points')
  })
})

describe('a 50 MB file through the command line', () => {
  it('is refused at once when it is one line of brackets', () => {
    const target = file('brackets.csv', `Force (${'('.repeat(50 * 1024 * 1024)}`)
    const run = runAnalyze([target])
    expect(run.status).toBe(2)
    expect(run.stderr).toMatch(/Line 1 is longer than 10,000 characters/)
  })

  it('is refused from its size when it exceeds the file limit', () => {
    const target = path.join(directory, 'sparse.csv')
    writeFileSync(target, '')
    truncateSync(target, RECORD_LIMITS.characters + 1) // sparse: no disk space used
    const run = runAnalyze([target])
    expect(run.status).toBe(2)
    expect(run.stderr).toMatch(/longer than 268,435,456 characters/)
  })

  it('is analysed when it is a genuine record (Hollomon n = 0.22 recovered, ASTM E646)', () => {
    const samples = 720_000 // about 52 MB in this dialect
    const hollomon = hollomonCurve(200_000, 530, 0.22, samples)
    const curve = { ...hollomon, expected: {} } as unknown as SyntheticCurve
    const target = file('long.csv', writeRecord(curve, PLAIN_FORMAT))
    const run = runAnalyze([target, '--json'])
    expect(run.stderr).toBe('')
    const result = JSON.parse(run.stdout) as { points: number; strainHardeningExponent: number }
    expect(result.points).toBe(samples + 2)
    // Hollomon (1945) σ = K εⁿ: the log–log fit of ASTM E646 returns n.
    expect(Math.abs(result.strainHardeningExponent - 0.22)).toBeLessThan(0.01)
  })
})

describe('no control character reaches a message', () => {
  const hostile = 'x\u001b[2J\u0007\u202eevil\r\nsecond line'

  it.each([
    [
      'a cell of the body',
      body.map((l, i) => (i === 50 ? l.replace(/,[^,]*,nan$/, `,${hostile},nan`) : l)),
    ],
    ['the unit of a column', null],
  ])('from %s', (_name, lines) => {
    const text =
      lines === null
        ? withHeader(header!.replace('Force [N]', `Force [${hostile}]`))
        : [preambleA, preambleB, preambleC, header, ...lines].join('\n')
    const run = runAnalyze([file('control.csv', text)])
    expect(run.status).toBe(2)
    const message = run.stderr.replace(/\n$/, '')
    expect(message).not.toMatch(CONTROL)
    expect(message.split('\n')).toHaveLength(1)
  })

  it('from a file name', () => {
    const run = runAnalyze([path.join(directory, `missing${hostile}.csv`)])
    expect(run.status).toBe(2)
    expect(run.stderr.replace(/\n$/, '')).not.toMatch(CONTROL)
  })

  it('from an option, which is refused', () => {
    const run = runAnalyze([file('ok.csv', good), '--force-column', hostile])
    expect(run.status).toBe(2)
    expect(run.stderr.replace(/\n$/, '')).not.toMatch(CONTROL)
  })
})
