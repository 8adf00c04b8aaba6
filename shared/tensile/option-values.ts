import { TensileInputError } from './errors'
import { quoted } from './printable'
import { parseQuantity, quantityUnit } from './quantity'
import type { DecimalSeparator, Delimiter, FitRange } from './types'
import { unitFactor, type Quantity } from './units'

/*
 * The value syntax of the tensile options, the same on the command line and in the server's
 * request body: "12.5mm", "0.2,1", "100:400MPa", "2:10%", "5MPa,0.5%". Each parser returns the
 * value in the engine's units or throws a one-line TensileInputError saying how to write it.
 */

const MAX_LIST_ITEMS = 20

/** A positive length; a bare number is mm. */
export function parseLength(text: string): number {
  const mm = parseQuantity(text, 'length', 'mm')
  if (!(mm > 0)) throw new TensileInputError('give a positive length such as 12.5mm or 0.5in')
  return mm
}

/** A positive area; a bare number is mm². */
export function parseArea(text: string): number {
  const mm2 = parseQuantity(text, 'area', 'mm2')
  if (!(mm2 > 0)) throw new TensileInputError('give a positive area such as 78.5mm2 or 0.2in2')
  return mm2
}

function listItems(text: string): string[] {
  const items = text.split(',')
  if (items.length > MAX_LIST_ITEMS)
    throw new TensileInputError(`give at most ${MAX_LIST_ITEMS} values`)
  return items
}

/** "0.2" or "0.2,1": offsets in percent, each above 0 and below 50. */
export function parseOffsets(text: string): number[] {
  const offsets = listItems(text).map((part) => (part.trim() === '' ? Number.NaN : Number(part)))
  if (offsets.some((o) => !(o > 0 && o < 50)))
    throw new TensileInputError('give positive percentages such as 0.2 or 0.2,1')
  return offsets
}

function rangeIn(fromText: string, toText: string, unit: string, quantity: Quantity) {
  return [parseQuantity(fromText, quantity, unit), parseQuantity(toText, quantity, unit)]
}

/** "100:400MPa" (stress) or "0.05:0.2%" (strain); the unit after the second number serves both. */
export function parseFitRange(text: string): FitRange {
  const [fromText = '', toText = '', extra] = text.split(':')
  const unit = quantityUnit(toText)
  const quantity: Quantity | null =
    unit === '' ? null : unitFactor(unit, 'stress') !== null ? 'stress' : 'strain'
  if (quantity === null || extra !== undefined || unitFactor(unit, quantity) === null)
    throw new TensileInputError('write it as 100:400MPa or 0.05:0.2%')
  const [from = 0, to = 0] = rangeIn(fromText, toText, unit, quantity)
  if (!(from >= 0 && to > from))
    throw new TensileInputError('the range must rise from a value of zero or more')
  return quantity === 'stress' ? { quantity, fromMPa: from, toMPa: to } : { quantity, from, to }
}

const HARDENING_RANGE = /^\s*(\d+(?:\.\d*)?)\s*:\s*(\d+(?:\.\d*)?)\s*%?\s*$/

/** "2:10%": the engineering-strain range of the strain-hardening fit, in percent. */
export function parseHardeningRange(text: string): { from: number; to: number } {
  const match = HARDENING_RANGE.exec(text)
  const from = Number(match?.[1])
  const to = Number(match?.[2])
  if (!match || !(to > from)) throw new TensileInputError('write it as 2:10%')
  return { from, to }
}

/** Properties a specification limits and a lab states an expanded uncertainty for. */
export const UNCERTAINTY_KEYS = ['Rp0.2', 'ReH', 'Rt0.5', 'Rm', 'A', 'Z'] as const
export type UncertaintyKey = (typeof UNCERTAINTY_KEYS)[number]
const STRENGTH_KEYS: readonly UncertaintyKey[] = ['Rp0.2', 'ReH', 'Rt0.5', 'Rm']
const PERCENT_KEYS: readonly UncertaintyKey[] = ['A', 'Z']

function uncertaintyKey(name: string): UncertaintyKey {
  const key = UNCERTAINTY_KEYS.find((k) => k.toLowerCase() === name.trim().toLowerCase())
  if (key === undefined)
    throw new TensileInputError(`${quoted(name)} is not one of ${UNCERTAINTY_KEYS.join(', ')}`)
  return key
}

function uncertaintyValue(part: string, percent: boolean): number {
  const value = percent
    ? Number(part.replace('%', '').trim())
    : parseQuantity(part, 'stress', 'MPa')
  if (!(value >= 0) || part.trim() === '')
    throw new TensileInputError('write it as 5MPa,0.5% or Rp0.2=6MPa,Rm=5MPa,A=0.6%')
  return value
}

/**
 * Expanded uncertainty U per property: "5MPa,0.5%" gives every strength 5 MPa and A and Z
 * 0.5 percentage points; "Rm=4MPa" or "A=0.6%" sets one property (later parts win).
 */
export function parseUncertainty(text: string): Partial<Record<UncertaintyKey, number>> {
  const expanded: Partial<Record<UncertaintyKey, number>> = {}
  for (const part of listItems(text)) {
    const [name, valueText] = part.includes('=') ? part.split('=', 2) : [undefined, part]
    const keys = name === undefined ? null : [uncertaintyKey(name)]
    const percent =
      keys === null ? quantityUnit(valueText ?? '') === '%' : PERCENT_KEYS.includes(keys[0]!)
    const value = uncertaintyValue(valueText ?? '', percent)
    for (const key of keys ?? (percent ? PERCENT_KEYS : STRENGTH_KEYS)) expanded[key] = value
  }
  return expanded
}

const DELIMITERS: Readonly<Record<string, Delimiter>> = {
  comma: ',',
  ',': ',',
  semicolon: ';',
  ';': ';',
  tab: '\t',
  '\\t': '\t',
  '\t': '\t',
  pipe: '|',
  '|': '|',
}
const DECIMALS: Readonly<Record<string, DecimalSeparator>> = {
  point: '.',
  '.': '.',
  comma: ',',
  ',': ',',
}

function lookup<T>(table: Readonly<Record<string, T>>, text: string, names: string): T {
  const found = table[text.toLowerCase()] ?? table[text]
  if (found === undefined) throw new TensileInputError(`use one of ${names}`)
  return found
}

export function parseDelimiter(text: string): Delimiter {
  return lookup(DELIMITERS, text, 'comma, semicolon, tab, pipe')
}

export function parseDecimal(text: string): DecimalSeparator {
  return lookup(DECIMALS, text, 'point, comma')
}

/** A unit that replaces the header's for a column: it must be a unit of the column's quantity. */
export function parseUnitFor(quantity: Quantity): (text: string) => string {
  return (text) => {
    if (unitFactor(text, quantity) === null)
      throw new TensileInputError(`not a ${quantity} unit the engine knows`)
    return text
  }
}
