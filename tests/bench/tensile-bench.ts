import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { performance } from 'node:perf_hooks'
import { analyseCurve, buildCurve, importRecord } from '../../shared/tensile'
import { rambergOsgoodCurve, withStressNoise } from '../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord } from '../helpers/tensile/dialects'
import { STRUCTURAL_STEEL } from '../helpers/tensile/specimens'
import { printCommandLineStart } from './cli-start'

/*
 * Benchmark: import and analysis of 10k, 100k and 1M-point records against a bare
 * baseline (read the file, split, convert every number). Medians of 5 runs; the peak resident
 * memory of the process after each size. A benchmark prints figures; it asserts nothing.
 */
const SIZES = [10_000, 100_000, 1_000_000]
const RUNS = 5

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

function measure(file: string) {
  const baseline: number[] = []
  const imports: number[] = []
  const analyses: number[] = []
  let points = 0
  // One untimed pass first, so the JIT has compiled the code before the clock runs.
  analyseCurve(buildCurve(importRecord(readFileSync(file, 'utf8'))))
  for (let run = 0; run < RUNS; run++) {
    baseline.push(timed(() => bareBaseline(file))[0])
    const [importTime, record] = timed(() => importRecord(readFileSync(file, 'utf8')))
    imports.push(importTime)
    analyses.push(timed(() => analyseCurve(buildCurve(record)))[0])
    points = record.points
  }
  return { points, baseline: median(baseline), import: median(imports), analysis: median(analyses) }
}

async function main(): Promise<void> {
  const directory = mkdtempSync(path.join(tmpdir(), 'fractolog-bench-'))
  console.log(
    'points      import ms  analysis ms  import+analysis ms  baseline ms  ratio  peak RSS MB',
  )
  try {
    for (const size of SIZES) {
      const m = measure(writeSample(directory, size))
      const total = m.import + m.analysis
      const peakMb = process.resourceUsage().maxRSS / 1024
      const cells = [m.points, m.import, m.analysis, total, m.baseline, total / m.baseline, peakMb]
      const widths = [10, 10, 12, 19, 12, 6, 12]
      console.log(
        cells
          .map((v, i) => (i === 0 ? String(v) : v.toFixed(i === 5 ? 2 : 1)).padStart(widths[i]!))
          .join(' '),
      )
    }
    await printCommandLineStart(directory, readFileSync(writeSample(directory, 10_000), 'utf8'))
  } finally {
    rmSync(directory, { recursive: true, force: true })
  }
}

await main()
