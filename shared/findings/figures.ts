import { blocksOf, inlinesOf } from './check-document'
import type { Figure, FindingsDocument } from './document'

/** Figure numbers follow the order of the figures in the text: the first one is Figure 1. */
export function figureNumbers(doc: FindingsDocument): Map<string, number> {
  const numbers = new Map<string, number>()
  for (const block of blocksOf(doc)) {
    if (block.type === 'figure' && !numbers.has(block.attrs.figureId))
      numbers.set(block.attrs.figureId, numbers.size + 1)
  }
  return numbers
}

export function figuresOf(doc: FindingsDocument): Figure[] {
  return [...blocksOf(doc)].filter((block): block is Figure => block.type === 'figure')
}

/** The label a cross-reference shows: "Figure 3", or "Figure ?" when its figure was removed. */
export function figureLabel(numbers: Map<string, number>, figureId: string): string {
  const number = numbers.get(figureId)
  return number === undefined ? 'Figure ?' : `Figure ${number}`
}

/** Cross-references whose figure is no longer in the draft. */
export function danglingFigureRefs(doc: FindingsDocument): string[] {
  const numbers = figureNumbers(doc)
  const dangling: string[] = []
  for (const inline of inlinesOf(doc)) {
    if (inline.type === 'figureRef' && !numbers.has(inline.attrs.figureId))
      dangling.push(inline.attrs.figureId)
  }
  return dangling
}
