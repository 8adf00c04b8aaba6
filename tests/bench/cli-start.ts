import { execFileSync, spawn } from 'node:child_process'
import { constants } from 'node:fs'
import { open } from 'node:fs/promises'
import path from 'node:path'
import { performance } from 'node:perf_hooks'

/*
 * How long the command line takes to start before it reads its input, not counting npm: the
 * record is offered through a named pipe, and opening the pipe for writing completes at the
 * moment the command line opens it to read. Compiled (dist-server/analyze.js, built by
 * `npm run build:server`) beside the TypeScript source run through tsx. Medians of 5 runs.
 */
const RUNS = 5

const COMMANDS: { label: string; args: string[] }[] = [
  { label: 'compiled (node dist-server/analyze.js)', args: ['dist-server/analyze.js'] },
  { label: 'source through tsx', args: ['--import', 'tsx', 'server/cli/analyze.ts'] },
]

interface Timing {
  startMs: number
  totalMs: number
}

async function timeOnce(args: string[], fifo: string, record: string): Promise<Timing> {
  const began = performance.now()
  const child = spawn(process.execPath, [...args, fifo, '--json'], { stdio: 'ignore' })
  const exited = new Promise<number>((done) => child.once('exit', (code) => done(code ?? 1)))
  const opened = open(fifo, 'w')
  const first = await Promise.race([opened.then(() => 'opened' as const), exited])
  if (first !== 'opened') {
    // release our waiting writer before failing: a reader that comes and goes unblocks it
    await (await open(fifo, constants.O_RDONLY | constants.O_NONBLOCK)).close()
    throw new Error(`the command line exited with ${first} before reading its input`)
  }
  const startMs = performance.now() - began
  const writer = await opened
  await writer.writeFile(record)
  await writer.close()
  const code = await exited
  if (code !== 0) throw new Error(`the command line exited with ${code}`)
  return { startMs, totalMs: performance.now() - began }
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.floor(sorted.length / 2)] ?? NaN
}

/** Prints start-up and whole-run times of the command line for one record. */
export async function printCommandLineStart(directory: string, record: string): Promise<void> {
  const fifo = path.join(directory, 'record.fifo')
  execFileSync('mkfifo', [fifo])
  const points = record.split('\n').length
  console.log(`\ncommand line, one ${points}-line record   start before reading ms   whole run ms`)
  for (const { label, args } of COMMANDS) {
    const timings: Timing[] = []
    for (let run = 0; run < RUNS; run++) timings.push(await timeOnce(args, fifo, record))
    const start = median(timings.map((timing) => timing.startMs))
      .toFixed(0)
      .padStart(25)
    const total = median(timings.map((timing) => timing.totalMs))
      .toFixed(0)
      .padStart(15)
    console.log(`${label.padEnd(40)}${start}${total}`)
  }
}
