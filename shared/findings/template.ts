import type { Block, FindingsDocument } from './document'
import { headingLevelOf, SECTION_KEYS, SECTION_TITLES } from './sections'

/** A new draft: the usual sections as headings, each followed by an empty paragraph. */
export function findingsTemplate(): FindingsDocument {
  const content: Block[] = []
  for (const key of SECTION_KEYS) {
    content.push({
      type: 'heading',
      attrs: { level: headingLevelOf(key), section: key },
      content: [{ type: 'text', text: SECTION_TITLES[key] }],
    })
    if (key !== 'examinations') content.push({ type: 'paragraph' })
  }
  return { type: 'doc', content }
}
