/*
 * Size limits of a record (our own choice). A testing machine writes lines of a few dozen
 * characters and a few million points at most; anything far beyond is refused with a message
 * before it can hold the server's memory or time.
 */
export const RECORD_LIMITS = {
  /** Characters in the whole record (about 256 MB of text). */
  characters: 256 * 1024 * 1024,
  /** Characters in one line. */
  lineCharacters: 10_000,
  /** Characters in one cell of the preamble, header or units row. */
  cellCharacters: 1_000,
  /** Cells in one row. */
  columns: 1_000,
  /** Data points read from the body. */
  points: 5_000_000,
  /** Lines searched for the header and the start of the data. */
  headLines: 5_000,
  /** Characters searched for the header and the start of the data. */
  headCharacters: 1024 * 1024,
} as const

/** 1234567 → "1,234,567", for limits in messages. */
export function groupedNumber(value: number): string {
  return String(value).replace(/\B(?=(\d{3})+$)/g, ',')
}
