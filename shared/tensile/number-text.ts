import type { DecimalSeparator } from './types'

const NOT_A_NUMBER_WORDS = new Set(['nan', '-nan', 'inf', '-inf', '+inf', 'infinity', '-infinity'])

/** Reads one cell as a finite number; NaN for anything else (empty cells included). */
export function parseNumberCell(cell: string, decimal: DecimalSeparator): number {
  const text = cell.trim()
  if (text === '') return Number.NaN
  const value = Number(decimal === ',' ? text.replace(',', '.') : text)
  return Number.isFinite(value) ? value : Number.NaN
}

/**
 * True for cells that belong to a numeric data row: numbers, and the "nan"/"inf" words that
 * machines write into derived columns (true stress after maximum force, for example).
 */
export function isNumericLike(cell: string, decimal: DecimalSeparator): boolean {
  const text = cell.trim().toLowerCase()
  return NOT_A_NUMBER_WORDS.has(text) || !Number.isNaN(parseNumberCell(text, decimal))
}
