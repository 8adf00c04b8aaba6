import { withoutControlCharacters } from './printable'

/**
 * A problem with the input (file, columns, geometry or options) that the person running the
 * analysis can fix. The message is meant to be shown as it is: one line, naming the line or
 * column where the problem was found, with no control characters whatever the input held.
 */
export class TensileInputError extends Error {
  constructor(message: string) {
    super(withoutControlCharacters(message))
    this.name = 'TensileInputError'
  }
}
