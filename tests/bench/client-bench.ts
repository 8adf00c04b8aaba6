import { brotliCompressSync } from 'node:zlib'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { runStep } from '../../scripts/run-step'
import {
  CLIENT_DIR,
  entryFiles,
  FIRST_VISIT_BUDGET,
  gzipSize,
  journeyFiles,
  pageFiles,
  readManifest,
  routeViews,
  totalGzipSize,
  viewAt,
} from '../helpers/client-bundle'

/*
 * Benchmark: the JavaScript each page of the built client makes the browser fetch, counted as
 * each file gzipped at level 9 (the budget's measure) and as the brotli copies the server sends.
 * Builds the client first unless given --no-build. Prints figures; asserts nothing (the budget
 * itself is checked by tests/e2e/client-budget.test.ts).
 */

const kB = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`.padStart(9)

function brotliSize(file: string): number {
  return brotliCompressSync(readFileSync(join(CLIENT_DIR, file))).length
}

function line(label: string, files: string[]): string {
  const brotli = files.reduce((sum, file) => sum + brotliSize(file), 0)
  const count = `${files.length} files`.padStart(9)
  return `${label.padEnd(34)}${count}${kB(totalGzipSize(files))}${kB(brotli)}`
}

async function main(): Promise<void> {
  if (!process.argv.includes('--no-build')) {
    const code = await runStep('npx', ['vite', 'build', '--logLevel', 'warn'])
    if (code !== 0) process.exit(code)
  }
  const manifest = readManifest()
  console.log(
    `${'page (JavaScript fetched)'.padEnd(34)}${'count'.padStart(9)}${'gzip -9'.padStart(9)}${'brotli'.padStart(9)}`,
  )
  console.log(line('app entry (every page)', entryFiles(manifest)))
  for (const route of routeViews()) console.log(line(route.path, pageFiles(manifest, route.source)))

  const journey = journeyFiles(manifest, [viewAt('/sign-in'), viewAt('/cases')])
  console.log(`\n${line('first visit: /sign-in then /cases', journey)}`)
  const total = totalGzipSize(journey)
  console.log(
    `budget ${kB(FIRST_VISIT_BUDGET).trim()}: ${total <= FIRST_VISIT_BUDGET ? 'within' : 'OVER'}`,
  )
  console.log('\nlargest files of the first visit (gzip -9):')
  const largest = [...journey].sort((a, b) => gzipSize(b) - gzipSize(a)).slice(0, 8)
  for (const file of largest) console.log(`  ${kB(gzipSize(file))}  ${file}`)
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : String(error))
  process.exit(1)
})
