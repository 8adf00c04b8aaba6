import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { performance } from 'node:perf_hooks'
import { analyseCurve, buildCurve, importRecord } from '../../shared/tensile'
import { fileChunks } from '../../server/cli/read-record'
import { rambergOsgoodCurve, withStressNoise } from '../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord } from '../helpers/tensile/dialects'
import { REPO_ROOT } from '../helpers/tensile/run-cli'
import { STRUCTURAL_STEEL } from '../helpers/tensile/specimens'
import { printCommandLineStart } from './cli-start'

/*
 * Benchmark: import and analysis of 10k, 100k and 1M-point records, read in chunks as the
 * command line reads them, against a bare baseline (read the whole file, split it, convert
 * every number). Medians of 5 to 25 runs. Then the command line itself on each record, in a child
 * process, with its peak resident memory. A benchmark prints figures; it asserts nothing.
 * Targets (issue): analysis at most 1.5 × the bare parse; the command line under 150 MB at 1M.
 */
const SIZES = [10_000, 100_000, 1_000_000]

/** More runs for the small records, whose few milliseconds a busy machine easily disturbs. */
function runsFor(size: number): number {
  return Math.min(25, Math.max(5, Math.round(2_000_000 / size)))
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.floor(sorted.length / 2)]!
}

function timed<T>(work: () => T): [number, T] {
  const start = performance.now()
  const value = work()
  return [performance.now() - start, value]
}

/** The bare baseline: read, split into lines and cells, convert every number. */
function bareBaseline(file: string): number {
  const lines = readFileSync(file, 'utf8').split('\n')
  let sum = 0
  for (const line of lines) for (const cell of line.split(',')) sum += Number(cell) || 0
  return sum
}

function writeSample(directory: string, points: number): string {
  const curve = withStressNoise(
    rambergOsgoodCurve({ ...STRUCTURAL_STEEL, samples: points * 0.8 }),
    0.001,
    7,
  )
  const file = path.join(directory, `record-${points}.csv`)
  writeFileSync(file, writeRecord(curve, PLAIN_FORMAT))
  return file
}

function measure(file: string, size: number) {
  const baseline: number[] = []
  const imports: number[] = []
  const analyses: number[] = []
  let points = 0
  // Untimed passes first, so the JIT has compiled the code before the clock runs.
  for (let warm = 0; warm < 3; warm++) analyseCurve(buildCurve(importRecord(fileChunks(file))))
  for (let run = 0; run < runsFor(size); run++) {
    baseline.push(timed(() => bareBaseline(file))[0])
    const [importTime, record] = timed(() => importRecord(fileChunks(file)))
    imports.push(importTime)
    analyses.push(timed(() => analyseCurve(buildCurve(record)))[0])
    points = record.points
  }
  return { points, baseline: median(baseline), import: median(imports), analysis: median(analyses) }
}

/** Peak resident memory of the command line analysing `file`, in MB. */
function commandLinePeakMb(file: string): number {
  const run = spawnSync(
    process.execPath,
    [
      '--import',
      'tsx',
      '--import',
      './tests/bench/report-peak-memory.ts',
      'server/cli/analyze.ts',
      file,
      '--json',
    ],
    { cwd: REPO_ROOT, encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] },
  )
  const kb = Number(/peak-rss-kb (\d+)/.exec(run.stderr)?.[1])
  if (run.status !== 0 || !Number.isFinite(kb))
    throw new Error(`command line failed: ${run.stderr}`)
  return kb / 1024
}

const COLUMNS: [string, number][] = [
  ['points', 10],
  ['import ms', 10],
  ['analysis ms', 12],
  ['import+analysis ms', 19],
  ['bare parse ms', 14],
  ['ratio', 6],
  ['CLI peak RSS MB', 16],
]

async function main(): Promise<void> {
  const directory = mkdtempSync(path.join(tmpdir(), 'fractolog-bench-'))
  console.log(COLUMNS.map(([title, width]) => title.padStart(width)).join(' '))
  try {
    for (const size of SIZES) {
      const file = writeSample(directory, size)
      const m = measure(file, size)
      const total = m.import + m.analysis
      const cells = [m.points, m.import, m.analysis, total, m.baseline, total / m.baseline]
      const shown = cells.map((v, i) => (i === 0 ? String(v) : v.toFixed(i === 5 ? 2 : 1)))
      shown.push(commandLinePeakMb(file).toFixed(1))
      console.log(shown.map((text, i) => text.padStart(COLUMNS[i]![1])).join(' '))
    }
    await printCommandLineStart(directory, readFileSync(writeSample(directory, 10_000), 'utf8'))
  } finally {
    rmSync(directory, { recursive: true, force: true })
  }
}

await main()
