import { blocksOf } from './check-document'
import type { Block, FindingsDocument } from './document'
import type { SectionKey } from './sections'

const squeeze = (text: string) => text.replace(/\s+/g, ' ').trim()

function textOf(block: Block): string {
  const parts: string[] = []
  for (const inner of blocksOf({ type: 'doc', content: [block] })) {
    if ((inner.type === 'paragraph' || inner.type === 'heading') && inner.content)
      for (const inline of inner.content) if (inline.type === 'text') parts.push(inline.text)
  }
  return parts.join('')
}

/**
 * The template section a quoted passage sits in: the section of the last section heading before
 * the first block that holds the passage. Null when the passage is not found (or precedes every
 * section heading).
 */
export function sectionOfQuote(doc: FindingsDocument, quote: string): SectionKey | null {
  const wanted = squeeze(quote)
  if (!wanted) return null
  let section: SectionKey | null = null
  for (const block of doc.content) {
    if (block.type === 'heading' && block.attrs.section) section = block.attrs.section
    if (squeeze(textOf(block)).includes(wanted)) return section
  }
  return null
}
