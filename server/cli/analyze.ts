import {
  analyseSpecimens,
  STARTER_SPECIFICATIONS,
  TensileInputError,
  withoutControlCharacters,
} from '../../shared/tensile'
import { parseCommandLine, USAGE } from './analyze-options'
import { formatReport } from './analyze-report'
import { fileChunks } from './read-record'

/*
 * Command-line entry, a public contract that lab staff script:
 *   npm run -s analyze -- FILE... [options]
 * A thin wrapper over the engine's pipeline: flags become the engine's options object, files
 * become record sources, and --json prints the pipeline's result as it is.
 * Bad input or usage exits with status 2 and one line on stderr; stdout stays empty.
 */

function specificationList(json: boolean): string {
  if (json) return JSON.stringify(STARTER_SPECIFICATIONS, null, 2)
  return STARTER_SPECIFICATIONS.map(
    (s) => `${s.designation.padEnd(14)}${s.standard} ${s.grade} (${s.source})`,
  ).join('\n')
}

function run(argv: readonly string[]): string {
  const command = parseCommandLine(argv)
  if (command === 'help') return USAGE
  if (command === 'list') return specificationList(argv.includes('--json'))
  const specimens = command.files.map((file) => ({ name: file, source: fileChunks(file) }))
  const report = analyseSpecimens(specimens, command.options)
  if (command.json) return JSON.stringify(report, null, 2)
  return formatReport(report, command.options.units ?? 'si')
}

function main(): void {
  try {
    process.stdout.write(`${run(process.argv.slice(2))}\n`)
  } catch (error) {
    const known = error instanceof TensileInputError
    const message = error instanceof Error ? error.message : String(error)
    const line = withoutControlCharacters(message.split('\n')[0] ?? '')
    process.stderr.write(`analyze: ${known ? line : `internal error: ${line}`}\n`)
    process.exitCode = known ? 2 : 1
  }
}

main()
