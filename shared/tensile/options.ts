import { z } from 'zod/mini'
import { TensileInputError } from './errors'
import {
  parseArea,
  parseDecimal,
  parseDelimiter,
  parseFitRange,
  parseHardeningRange,
  parseLength,
  parseOffsets,
  parseUncertainty,
  parseUnitFor,
} from './option-values'
import { quoted, withoutControlCharacters } from './printable'
import { findSpecification } from './specifications'

/*
 * The options contract of the tensile engine: one object whose names are the command line's
 * flags in camelCase (--fit-range → fitRange) and whose values are written as on the command
 * line ("12.5mm", "0.2,1", "100:400MPa"). The command line and the server validate with this
 * one schema; zod/mini keeps it cheap for the browser.
 */

const MAX_TEXT = 200

function checkedBy(parse: (text: string) => unknown) {
  return z.superRefine((text: string, ctx) => {
    try {
      parse(text)
    } catch (error) {
      if (!(error instanceof TensileInputError)) throw error
      ctx.issues.push({ code: 'custom', message: error.message, input: text })
    }
  })
}

function printableText(text: string): void {
  if (withoutControlCharacters(text) !== text)
    throw new TensileInputError('remove the control characters')
}

/** An option written as text and checked by the parser that later reads it. */
function text(parse: (text: string) => unknown = printableText) {
  return z.optional(
    z
      .string('write it as text')
      .check(
        z.minLength(1, 'give a value'),
        z.maxLength(MAX_TEXT, `use at most ${MAX_TEXT} characters`),
        checkedBy(parse),
      ),
  )
}

function knownSpecification(designation: string): void {
  if (findSpecification(designation) === null)
    throw new TensileInputError('not a known specification record')
}

const fields = {
  diameter: text(parseLength),
  width: text(parseLength),
  thickness: text(parseLength),
  outerDiameter: text(parseLength),
  wall: text(parseLength),
  area: text(parseArea),
  gaugeLength: text(parseLength),
  originalGaugeLength: text(parseLength),
  finalGaugeLength: text(parseLength),
  finalDiameter: text(parseLength),
  finalWidth: text(parseLength),
  finalThickness: text(parseLength),
  finalArea: text(parseArea),
  offset: text(parseOffsets),
  fitRange: text(parseFitRange),
  hardeningRange: text(parseHardeningRange),
  delimiter: text(parseDelimiter),
  decimal: text(parseDecimal),
  forceColumn: text(),
  forceUnit: text(parseUnitFor('force')),
  extensionColumn: text(),
  extensionUnit: text(parseUnitFor('length')),
  strainColumn: text(),
  strainUnit: text(parseUnitFor('strain')),
  stressColumn: text(),
  stressUnit: text(parseUnitFor('stress')),
  timeColumn: text(),
  timeUnit: text(parseUnitFor('time')),
  spec: text(knownSpecification),
  specEdition: text(),
  rule: z.optional(z.enum(['simple', 'guard'], 'use simple or guard')),
  uncertainty: text(parseUncertainty),
  uncertaintySource: text(),
  units: z.optional(z.enum(['si', 'us'], 'use si or us')),
}

/** Options that only make sense together with another one. */
const NEEDS: readonly [keyof typeof fields, keyof typeof fields, string][] = [
  ['specEdition', 'spec', 'name the specification too'],
  ['uncertaintySource', 'uncertainty', 'give the uncertainty too'],
]

export const TensileOptions = z.strictObject(fields).check(
  z.superRefine((options, ctx) => {
    if (options.rule === 'guard' && options.uncertainty === undefined) {
      const message = 'the guard-band rule needs the expanded uncertainty, e.g. 5MPa,0.5%'
      ctx.issues.push({ code: 'custom', message, input: options, path: ['uncertainty'] })
    }
    for (const [option, needed, message] of NEEDS) {
      if (options[option] !== undefined && options[needed] === undefined)
        ctx.issues.push({ code: 'custom', message, input: options, path: [option] })
    }
  }),
)
export type TensileOptions = z.infer<typeof TensileOptions>
export type TensileOptionName = keyof typeof fields

/** Every option's name, in the order the command line documents them. */
export const TENSILE_OPTION_NAMES = Object.keys(fields) as TensileOptionName[]

/**
 * Validates an options object and returns it typed. The first problem becomes one line that
 * names the option as `nameOf` writes it (a flag on the command line, a field elsewhere).
 */
export function checkTensileOptions(
  input: unknown,
  nameOf: (option: string) => string = (option) => option,
): TensileOptions {
  const parsed = TensileOptions.safeParse(input)
  if (parsed.success) return parsed.data
  const issue = parsed.error.issues[0]!
  if (issue.code === 'unrecognized_keys')
    throw new TensileInputError(
      `unknown option ${issue.keys.map((k) => quoted(nameOf(k))).join(', ')}`,
    )
  const option = String(issue.path[0] ?? '')
  const value = (input as Record<string, unknown>)[option]
  const shown = typeof value === 'string' ? ` ${quoted(value)}` : ''
  throw new TensileInputError(`${nameOf(option)}${shown}: ${issue.message}`)
}
