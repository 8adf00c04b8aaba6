import { TensileInputError } from './errors'
import { quoted } from './printable'
import { unitFactor, type Quantity } from './units'

const QUANTITY_PATTERN = /^\s*([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:e[+-]?\d+)?)\s*(\S*)\s*$/i

/**
 * Reads a number with an optional unit ("12.5mm", "0.5 in", "37.5mm2", "5MPa") and returns it
 * in the engine's unit for `quantity`. A bare number is taken in `defaultUnit` (mm, mm² …),
 * which is how lab staff write geometry on the command line.
 */
export function parseQuantity(text: string, quantity: Quantity, defaultUnit: string): number {
  const match = QUANTITY_PATTERN.exec(text)
  const numberText = match?.[1]
  if (numberText === undefined) {
    throw new TensileInputError(`${quoted(text)} is not a number with a unit`)
  }
  const unit = match?.[2] || defaultUnit
  const factor = unitFactor(unit, quantity)
  if (factor === null) {
    throw new TensileInputError(
      `${quoted(text)}: unit ${quoted(unit)} is not recognised as a ${quantity} unit`,
    )
  }
  return Number(numberText.replace(',', '.')) * factor
}

/** The unit written after a number, or '' when there is none. */
export function quantityUnit(text: string): string {
  return QUANTITY_PATTERN.exec(text)?.[2] ?? ''
}
