/*
 * Units written in brackets in a header or preamble cell: "Force [kN]", "Width (mm)". Hand-made
 * scans rather than regular expressions, so that a crafted cell of repeated brackets costs time
 * in proportion to its length, not to its square.
 */

const isOpening = (c: string | undefined) => c === '[' || c === '('
const isClosing = (c: string | undefined) => c === ']' || c === ')'

/**
 * A cell that ends in a bracketed unit, split into the name before it and the unit:
 * "Stress (true) [MPa]" → ["Stress (true)", "MPa"]; null when the cell does not end in one.
 * The unit holds no closing bracket, so it opens at the first bracket after the last closing
 * bracket before the end.
 */
export function splitTrailingUnit(cell: string): [name: string, unit: string] | null {
  const text = cell.trimEnd()
  const close = text.length - 1
  if (!isClosing(text[close])) return null
  let barrier = close - 1
  while (barrier >= 0 && !isClosing(text[barrier])) barrier--
  let open = barrier + 1
  while (open < close && !isOpening(text[open])) open++
  if (open >= close) return null
  return [text.slice(0, open).trim(), text.slice(open + 1, close).trim()]
}

/** The first bracketed part of a cell, "Gauge length (mm):" → "mm"; null when there is none. */
export function firstBracketed(cell: string): string | null {
  let open = 0
  while (open < cell.length && !isOpening(cell[open])) open++
  let close = open + 1
  while (close < cell.length && !isClosing(cell[close])) close++
  return close < cell.length ? cell.slice(open + 1, close).trim() : null
}

/** A units-row cell without its brackets: "[kN]" → "kN". */
export function withoutBrackets(cell: string): string {
  const start = isOpening(cell[0]) ? 1 : 0
  const end =
    cell.length > start && isClosing(cell[cell.length - 1]) ? cell.length - 1 : cell.length
  return cell.slice(start, end)
}
