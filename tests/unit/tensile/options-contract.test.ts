import { readFileSync } from 'node:fs'
import path from 'node:path'
import { describe, expect, it, vi } from 'vitest'
import {
  analyseSpecimens,
  checkTensileOptions,
  resolveOptions,
  TENSILE_OPTION_NAMES,
  TensileInputError,
  TensileOptions,
  type TensileOptions as Options,
} from '../../../shared/tensile'
import {
  flagName,
  FLAG_SPEC,
  optionName,
  optionsFromFlags,
  OUTPUT_FLAGS,
} from '../../../server/cli/analyze-options'
import { OPEN_RECORDS_DIR } from '../../helpers/tensile/open-records'
import { CLI_TEST_TIMEOUT_MS, runAnalyze } from '../../helpers/tensile/run-cli'

vi.setConfig({ testTimeout: CLI_TEST_TIMEOUT_MS })

const analysisFlags = Object.keys(FLAG_SPEC).filter(
  (flag) => !(OUTPUT_FLAGS as readonly string[]).includes(flag),
)

describe('the options contract: one option per command-line flag', () => {
  it('maps every flag to an option of the same name in camelCase and back', () => {
    for (const flag of analysisFlags) {
      expect(TENSILE_OPTION_NAMES).toContain(optionName(flag))
      expect(flagName(optionName(flag))).toBe(flag)
    }
  })

  it('has a flag for every option', () => {
    for (const option of TENSILE_OPTION_NAMES) expect(analysisFlags).toContain(flagName(option))
    expect(analysisFlags).toHaveLength(TENSILE_OPTION_NAMES.length)
  })

  it('names the options the issue lists, with their command-line spelling', () => {
    const pairs = [
      ['fit-range', 'fitRange'],
      ['outer-diameter', 'outerDiameter'],
      ['hardening-range', 'hardeningRange'],
      ['force-column', 'forceColumn'],
      ['extension-unit', 'extensionUnit'],
      ['uncertainty-source', 'uncertaintySource'],
    ]
    for (const [flag, option] of pairs) expect(optionName(flag!)).toBe(option)
  })

  it('turns parsed flag values into the options object', () => {
    expect(optionsFromFlags({ json: true, diameter: '12.5mm', 'fit-range': '100:400MPa' })).toEqual(
      { diameter: '12.5mm', fitRange: '100:400MPa' },
    )
  })
})

describe('the options schema', () => {
  it.each<[string, Options]>([
    ['geometry with and without units', { diameter: '12.5mm', gaugeLength: '2in', area: '0.2in2' }],
    ['a tube', { outerDiameter: '20mm', wall: '2' }],
    ['several offsets', { offset: '0.2,1' }],
    ['a stress fit range', { fitRange: '100:400MPa' }],
    ['a strain fit range', { fitRange: '0.05:0.2%' }],
    ['a hardening range', { hardeningRange: '2:10%' }],
    [
      'dialect and columns',
      { delimiter: 'semicolon', decimal: 'comma', forceColumn: '3', forceUnit: 'kN' },
    ],
    [
      'a guard band with its source',
      { spec: 'S355J2', rule: 'guard', uncertainty: '5MPa,0.5%', uncertaintySource: 'budget TB-7' },
    ],
    ['uncertainty per property', { uncertainty: 'Rp0.2=6MPa,Rm=5MPa,A=0.6%,Z=1%' }],
    ['the cited edition', { spec: 'S355J2', specEdition: '2019' }],
    ['US customary output', { units: 'us' }],
  ])('accepts %s', (_name, options) => {
    expect(TensileOptions.safeParse(options).success).toBe(true)
  })

  it.each<[string, Record<string, unknown>, string, RegExp]>([
    ['a diameter without a number', { diameter: 'wide' }, 'diameter', /not a number/],
    ['a negative diameter', { diameter: '-3mm' }, 'diameter', /positive/],
    ['a fit range without a unit', { fitRange: '100:400' }, 'fitRange', /100:400MPa/],
    ['a falling fit range', { fitRange: '400:100MPa' }, 'fitRange', /rise/],
    ['an offset of zero', { offset: '0' }, 'offset', /positive/],
    ['a force unit that is a length', { forceUnit: 'mm' }, 'forceUnit', /force unit/],
    ['an unknown specification', { spec: 'S999' }, 'spec', /not a known/],
    ['an unknown rule', { rule: 'lenient' }, 'rule', /simple or guard/],
    ['a guard band without U', { spec: 'S355J2', rule: 'guard' }, 'uncertainty', /needs/],
    ['an edition without a specification', { specEdition: '2019' }, 'specEdition', /specification/],
    ['an unknown property in U', { uncertainty: 'HV=3' }, 'uncertainty', /not one of/],
    [
      'a control character in a column name',
      { forceColumn: 'F\u001b[2J' },
      'forceColumn',
      /control/,
    ],
    ['a number where text belongs', { diameter: 12.5 }, 'diameter', /text/],
  ])('refuses %s, naming the option', (_name, options, option, message) => {
    const parsed = TensileOptions.safeParse(options)
    expect(parsed.success).toBe(false)
    const issue = parsed.error?.issues[0]
    expect(issue?.path).toEqual([option])
    expect(issue?.message).toMatch(message)
  })

  it('refuses options it does not know', () => {
    expect(() => checkTensileOptions({ diameterr: '10' })).toThrow(/unknown option 'diameterr'/)
  })

  it('reports a problem as one line naming the option as the caller writes it', () => {
    expect(() => checkTensileOptions({ offset: 'x' }, (o) => `--${flagName(o)}`)).toThrow(
      TensileInputError,
    )
    expect(() => checkTensileOptions({ fitRange: 'x' }, (o) => `--${flagName(o)}`)).toThrow(
      /^--fit-range 'x': /,
    )
  })
})

// Exact definitions of NIST SP 811 (appendix B): 1 in = 25.4 mm, 1 ksi = 6.894757293168361 MPa.
describe('options read into the engine’s units', () => {
  it('converts geometry, ranges and uncertainty', () => {
    const resolved = resolveOptions({
      diameter: '0.5in',
      gaugeLength: '50',
      fitRange: '10:40ksi',
      offset: '0.2,1',
      hardeningRange: '2:10%',
      spec: 'S355J2',
      rule: 'guard',
      uncertainty: '5MPa,0.5%,Rm=1ksi',
      uncertaintySource: 'budget TB-7',
    })
    expect(resolved.analysis.geometry?.section?.diameterMm).toBeCloseTo(12.7, 12)
    expect(resolved.analysis.geometry?.extensometerGaugeLengthMm).toBe(50)
    expect(resolved.analysis.fitRange).toEqual({
      quantity: 'stress',
      fromMPa: 68.94757293168361,
      toMPa: 275.79029172673444,
    })
    expect(resolved.analysis.offsetsPct).toEqual([0.2, 1])
    expect(resolved.analysis.hardeningRangePct).toEqual({ from: 2, to: 10 })
    expect(resolved.specification?.designation).toBe('S355J2')
    expect(resolved.basis.uncertainty).toEqual({
      expanded: { 'Rp0.2': 5, ReH: 5, 'Rt0.5': 5, Rm: 6.894757293168361, A: 0.5, Z: 0.5 },
      source: 'budget TB-7',
    })
  })
})

// The command line is a thin wrapper: its --json output is the pipeline's result, key for key
// and number for number, for the same options.
describe('the command line and the pipeline give the same result', () => {
  const files = ['46NT71.csv', '46NT73.csv'].map((f) => path.join(OPEN_RECORDS_DIR, f))
  const flags = [
    '--offset',
    '0.2,1',
    '--spec',
    '42CrMo4+QT',
    '--spec-edition',
    '2016',
    '--rule',
    'guard',
    '--uncertainty',
    '8MPa,0.5%',
    '--uncertainty-source',
    'budget TB-7',
    '--final-diameter',
    '3.4mm',
  ]
  const options: Options = {
    offset: '0.2,1',
    spec: '42CrMo4+QT',
    specEdition: '2016',
    rule: 'guard',
    uncertainty: '8MPa,0.5%',
    uncertaintySource: 'budget TB-7',
    finalDiameter: '3.4mm',
  }
  const pipeline = (names: string[]) =>
    JSON.parse(
      JSON.stringify(
        analyseSpecimens(
          names.map((name) => ({ name, source: readFileSync(name, 'utf8') })),
          options,
        ),
      ),
    ) as unknown

  it.each([
    ['one record', files.slice(0, 1)],
    ['two records and their summary', files],
  ])('for %s', (_name, names) => {
    const run = runAnalyze([...names, ...flags, '--json'])
    expect(run.stderr).toBe('')
    expect(run.status).toBe(0)
    expect(JSON.parse(run.stdout)).toEqual(pipeline(names))
  })
})
