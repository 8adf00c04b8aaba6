/**
 * A problem with the input (file, columns, geometry or options) that the person running the
 * analysis can fix. The message is meant to be shown as it is: one line, naming the line or
 * column where the problem was found.
 */
export class TensileInputError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'TensileInputError'
  }
}
