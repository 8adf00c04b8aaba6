import { parseArgs } from 'node:util'
import {
  checkTensileOptions,
  TENSILE_OPTION_NAMES,
  TensileInputError,
  type TensileOptions,
} from '../../shared/tensile'

/** Everything the command line was asked to do. */
export interface CommandLine {
  files: string[]
  json: boolean
  options: TensileOptions
}

/** --fit-range ↔ fitRange: every engine option is a flag of the same name in kebab case. */
export function flagName(option: string): string {
  return option.replace(/[A-Z]/g, (letter) => `-${letter.toLowerCase()}`)
}

export function optionName(flag: string): string {
  return flag.replace(/-([a-z])/g, (_, letter: string) => letter.toUpperCase())
}

/** Flags that choose the output, not the analysis: they have no engine option. */
export const OUTPUT_FLAGS = ['json', 'help'] as const

export const FLAG_SPEC = {
  json: { type: 'boolean' },
  help: { type: 'boolean' },
  ...Object.fromEntries(
    TENSILE_OPTION_NAMES.map((option) => [flagName(option), { type: 'string' }]),
  ),
} as const

export const USAGE = [
  'usage: npm run -s analyze -- FILE... [--diameter 12.5mm | --width W --thickness T |',
  '  --outer-diameter D --wall T | --area S0] [--gauge-length Le] [--offset 0.2[,1]]',
  '  [--fit-range 100:400MPa] [--hardening-range 2:10%] [--spec NAME|list] [--spec-edition ED]',
  '  [--rule simple|guard] [--uncertainty 5MPa,0.5%] [--uncertainty-source TEXT] [--json] [--units si|us]',
  `flags: ${TENSILE_OPTION_NAMES.map((option) => `--${flagName(option)}`).join(' ')} --json --help`,
].join('\n')

/** The engine's options object from parsed flag values: --fit-range 1:2MPa → { fitRange: '1:2MPa' }. */
export function optionsFromFlags(values: Record<string, unknown>): Record<string, unknown> {
  const options: Record<string, unknown> = {}
  for (const [flag, value] of Object.entries(values)) {
    if (!(OUTPUT_FLAGS as readonly string[]).includes(flag)) options[optionName(flag)] = value
  }
  return options
}

function parseFlags(argv: readonly string[]) {
  try {
    return parseArgs({ args: [...argv], options: FLAG_SPEC, allowPositionals: true, strict: true })
  } catch (error) {
    throw new TensileInputError(error instanceof Error ? error.message.split('\n')[0]! : USAGE)
  }
}

/** Parses argv; every mistake is a TensileInputError with one line for the user. */
export function parseCommandLine(argv: readonly string[]): CommandLine | 'help' | 'list' {
  const parsed = parseFlags(argv)
  const values = parsed.values as Record<string, string | boolean | undefined>
  if (values.help === true) return 'help'
  if (values.spec === 'list') return 'list'
  if (parsed.positionals.length === 0) throw new TensileInputError(USAGE.split('\n')[0]!)
  const options = checkTensileOptions(optionsFromFlags(values), (option) => `--${flagName(option)}`)
  return { files: parsed.positionals, json: values.json === true, options }
}
