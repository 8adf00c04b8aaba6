import { TensileInputError } from './errors'
import { groupedNumber, RECORD_LIMITS } from './limits'
import type { RecordSource } from './types'

/**
 * Walks a record line by line without ever holding it whole: the source comes as one string or
 * in chunks, and each line is handed out as a range of the chunk it lies in. Only a line split
 * between two chunks is copied, joined into a string of its own; chunks are never concatenated,
 * which would make every later search in them slow. The size limits are checked on the way.
 */
export class RecordReader {
  /** The string the current line lies in, and where the line starts and ends (no line break). */
  text = ''
  start = 0
  end = 0
  /** 0-based number of the current line in the record. */
  line = -1
  private chunk = ''
  private position = 0
  /** Start of a line begun in an earlier chunk. */
  private carry = ''
  private quoteAt = -1
  /** The quote search belongs to another string than the next line's. */
  private quoteStale = true
  private characters = 0
  private finished = false
  private readonly chunks: Iterator<string>

  constructor(source: RecordSource) {
    const stated = typeof source === 'string' ? source.length : source.characters
    if (stated !== undefined && stated > RECORD_LIMITS.characters) this.tooBig()
    this.chunks = (typeof source === 'string' ? [source] : source)[Symbol.iterator]()
  }

  /** Moves to the next line; false at the end of the record. */
  next(): boolean {
    for (;;) {
      const newline = this.chunk.indexOf('\n', this.position)
      if (newline >= 0) return this.take(newline, newline + 1)
      this.carry += this.chunk.slice(this.position)
      if (this.carry.length > RECORD_LIMITS.lineCharacters) this.tooLong(this.line + 1)
      if (!this.refill()) return this.carry !== '' && this.takeCarry()
    }
  }

  /** Whether the current line holds a double quote; one scan of each chunk finds them all. */
  hasQuote(): boolean {
    if (this.quoteAt < this.start) {
      const found = this.text.indexOf('"', this.start)
      this.quoteAt = found < 0 ? Number.POSITIVE_INFINITY : found
    }
    return this.quoteAt < this.end
  }

  /** The current line as a string, without a trailing carriage return. */
  lineText(): string {
    const end =
      this.end > this.start && this.text.charCodeAt(this.end - 1) === 13 ? this.end - 1 : this.end
    return this.text.slice(this.start, end)
  }

  private take(newline: number, after: number): boolean {
    if (this.carry === '') {
      this.show(this.chunk, this.position, newline, false)
    } else {
      this.show(this.carry + this.chunk.slice(this.position, newline), 0, -1, true)
      this.carry = ''
    }
    this.position = after
    return true
  }

  private takeCarry(): boolean {
    this.show(this.carry, 0, -1, true)
    this.carry = ''
    return true
  }

  /** Makes a range the current line; an end of -1 means the whole of `text`. */
  private show(text: string, start: number, end: number, joined: boolean): void {
    if (this.quoteStale || joined) this.quoteAt = -1
    this.quoteStale = joined
    this.text = text
    this.start = start
    this.end = end < 0 ? text.length : end
    this.line++
    if (this.end - this.start > RECORD_LIMITS.lineCharacters) this.tooLong(this.line)
  }

  private refill(): boolean {
    if (this.finished) return false
    const next = this.chunks.next()
    if (next.done === true) {
      this.finished = true
      this.chunk = ''
      this.position = 0
      return false
    }
    this.characters += next.value.length
    if (this.characters > RECORD_LIMITS.characters) this.tooBig()
    this.chunk = next.value
    this.position = 0
    this.quoteStale = true
    return true
  }

  private tooBig(): never {
    throw new TensileInputError(
      `The record is longer than ${groupedNumber(RECORD_LIMITS.characters)} characters`,
    )
  }

  private tooLong(line: number): never {
    throw new TensileInputError(
      `Line ${line + 1} is longer than ${groupedNumber(RECORD_LIMITS.lineCharacters)} characters`,
    )
  }
}
