import { readFileSync } from 'node:fs'
import {
  analyseRecord,
  evaluateConformity,
  STARTER_SPECIFICATIONS,
  summariseSpecimens,
  TensileInputError,
  type ConformityResult,
  type TensileResult,
} from '../../shared/tensile'
import { parseCommandLine, USAGE, type CommandLine } from './analyze-options'
import { formatSummary, formatTable } from './analyze-report'

/*
 * Command-line entry, a public contract that lab staff script:
 *   npm run -s analyze -- FILE... [options]
 * Bad input or usage exits with status 2 and one line on stderr; stdout stays empty.
 */

/** Printed under every readable report: the figures are inputs to judgement, not a verdict. */
export const CAUTION = [
  'Computed from the record as given: results are only as good as the specimen measurements and',
  'the calibration of the machine and extensometer. Conformity follows the stated decision rule;',
  'check specification limits against the current edition of the standard, and leave conclusions',
  'to the applicable codes, the client’s specifications and licensed professional judgment.',
].join('\n')

export type FileResult = TensileResult & { file: string; conformity: ConformityResult | null }

function readText(file: string): string {
  try {
    return readFileSync(file, 'utf8')
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'unreadable'
    throw new TensileInputError(`Cannot read ${file} (${code})`)
  }
}

function analyseFile(file: string, command: CommandLine): FileResult {
  try {
    const result = analyseRecord(readText(file), command.analysis)
    const spec = command.specification
    return {
      file,
      ...result,
      conformity: spec === null ? null : evaluateConformity(result, spec, command.rule),
    }
  } catch (error) {
    if (error instanceof TensileInputError) throw new TensileInputError(`${file}: ${error.message}`)
    throw error
  }
}

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
  const results = command.files.map((file) => analyseFile(file, command))
  if (results.length === 1) {
    const [only] = results as [FileResult]
    return command.json
      ? JSON.stringify(only, null, 2)
      : `${formatTable(only, command.units)}\n\n${CAUTION}`
  }
  const summary = {
    summary: { specimens: results.length, properties: summariseSpecimens(results) },
  }
  if (command.json) return JSON.stringify([...results, summary], null, 2)
  return [
    ...results.map((r) => formatTable(r, command.units)),
    formatSummary(summary.summary),
    CAUTION,
  ].join('\n\n')
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
