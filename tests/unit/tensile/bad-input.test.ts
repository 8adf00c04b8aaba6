import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { describe, expect, it, vi } from 'vitest'
import { rambergOsgoodCurve } from '../../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord } from '../../helpers/tensile/dialects'
import { CLI_TEST_TIMEOUT_MS, runAnalyze } from '../../helpers/tensile/run-cli'
import { STRUCTURAL_STEEL } from '../../helpers/tensile/specimens'

vi.setConfig({ testTimeout: CLI_TEST_TIMEOUT_MS })

const directory = mkdtempSync(path.join(tmpdir(), 'fractolog-bad-'))
const good = writeRecord(rambergOsgoodCurve({ ...STRUCTURAL_STEEL, samples: 200 }), PLAIN_FORMAT)
const goodLines = good.trimEnd().split('\n')
const header = goodLines.slice(0, 4) // three preamble lines and the header
const body = goodLines.slice(4)

function file(name: string, text: string): string {
  const target = path.join(directory, name)
  writeFileSync(target, text)
  return target
}

function replaceCell(line: string, position: number, value: string): string {
  const cells = line.split(',')
  cells[position] = value
  return cells.join(',')
}

// Each kind of bad file the importer refuses: exit status 2, one line on stderr naming the
// problem, nothing on stdout, no stack trace.
const CASES: [string, string[], RegExp][] = [
  ['an empty file', [file('empty.csv', '')], /empty/],
  ['a file without numbers', [file('words.csv', 'a,b\nc,d\ne,f\n')], /No numeric data/],
  ['a single column', [file('single.csv', 'Force [N]\n1\n2\n3\n4\n')], /one column/],
  [
    'fewer than 20 points',
    [file('short.csv', [...header, ...body.slice(0, 15)].join('\n'))],
    /15 usable .* 20/,
  ],
  [
    'a word in the force column',
    [
      file(
        'word.csv',
        [...header, ...body.slice(0, 50), replaceCell(body[50]!, 3, 'abc'), ...body.slice(51)].join(
          '\n',
        ),
      ),
    ],
    /Line 55, column 'Force': 'abc' is not a number/,
  ],
  [
    'time running backwards',
    [
      file(
        'time.csv',
        [...header, ...body.slice(0, 30), replaceCell(body[30]!, 0, '0'), ...body.slice(31)].join(
          '\n',
        ),
      ),
    ],
    /Line 35: time runs backwards/,
  ],
  [
    'an unknown force unit',
    [file('unit.csv', good.replace('Force [N]', 'Force [furlong]'))],
    /Force.*furlong/,
  ],
  [
    'force that never rises',
    [file('flat.csv', [...header, ...body.map((line) => replaceCell(line, 3, '5'))].join('\n'))],
    /never rises/,
  ],
  ['a missing file', [path.join(directory, 'missing.csv')], /Cannot read .*ENOENT/],
  ['an unknown option', [file('ok.csv', good), '--frobnicate'], /frobnicate/],
  ['a geometry without a number', [file('ok2.csv', good), '--diameter', 'wide'], /'wide'/],
]

describe('bad input through the command line', () => {
  it.each(CASES)('rejects %s cleanly', (_name, args, message) => {
    const run = runAnalyze(args)
    expect(run.status).toBe(2)
    expect(run.stdout).toBe('')
    expect(run.stderr.trimEnd().split('\n')).toHaveLength(1)
    expect(run.stderr).toMatch(message)
    expect(run.stderr).not.toMatch(/\n\s+at /)
  })

  it('ignores non-numeric cells in columns it does not use', () => {
    const run = runAnalyze([file('ignored.csv', good.replaceAll(',nan', ',n/a')), '--json'])
    expect(run.status).toBe(0)
  })
})
