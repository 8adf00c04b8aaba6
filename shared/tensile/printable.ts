/*
 * Text from a record or an option can carry control characters (escape sequences that repaint a
 * terminal, line breaks that forge a second message line, bidirectional overrides that reorder
 * what is shown). Messages print none of them.
 */
const UNPRINTABLE =
  /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g
const QUOTED_LENGTH = 60

/** The text with every control or direction-changing character replaced by U+FFFD. */
export function withoutControlCharacters(text: string): string {
  return text.replace(UNPRINTABLE, '\ufffd')
}

/** User text as a message quotes it: printable, and cut to a readable length. */
export function quoted(text: string, maxLength = QUOTED_LENGTH): string {
  const clean = withoutControlCharacters(text)
  const shown = clean.length > maxLength ? `${clean.slice(0, maxLength - 1)}…` : clean
  return `'${shown}'`
}
