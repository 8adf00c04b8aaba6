import { readFileSync } from 'node:fs'
import { analyseRecord, TensileInputError, type TensileResult } from '../../shared/tensile'
import { parseCommandLine, USAGE, type CommandLine } from './analyze-options'
import { formatTable } from './analyze-report'

/*
 * Command-line entry, a public contract that lab staff script:
 *   npm run -s analyze -- FILE [options]
 * Bad input or usage exits with status 2 and one line on stderr; stdout stays empty.
 */

function readText(file: string): string {
  try {
    return readFileSync(file, 'utf8')
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'unreadable'
    throw new TensileInputError(`Cannot read ${file} (${code})`)
  }
}

function analyseFile(file: string, command: CommandLine): TensileResult & { file: string } {
  try {
    return { file, ...analyseRecord(readText(file), command.analysis) }
  } catch (error) {
    if (error instanceof TensileInputError) throw new TensileInputError(`${file}: ${error.message}`)
    throw error
  }
}

function run(argv: readonly string[]): string {
  const command = parseCommandLine(argv)
  if (command === 'help') return USAGE
  const results = command.files.map((file) => analyseFile(file, command))
  if (command.json) return JSON.stringify(results.length === 1 ? results[0] : results, null, 2)
  return results.map((result) => formatTable(result, command.units, result.file)).join('\n\n')
}

function main(): void {
  try {
    process.stdout.write(`${run(process.argv.slice(2))}\n`)
  } catch (error) {
    const known = error instanceof TensileInputError
    const message = error instanceof Error ? error.message : String(error)
    process.stderr.write(`analyze: ${known ? message : `internal error: ${message}`}\n`)
    process.exitCode = known ? 2 : 1
  }
}

main()
