import { describe, expect, it } from 'vitest'
import type { FindingsDocument } from '../../shared/findings/document'
import { sectionOfQuote } from '../../shared/findings/quote-section'

const doc: FindingsDocument = {
  type: 'doc',
  content: [
    {
      type: 'heading',
      attrs: { level: 2, section: 'summary' },
      content: [{ type: 'text', text: 'Summary' }],
    },
    {
      type: 'paragraph',
      content: [
        { type: 'text', text: 'Fatigue from the ' },
        { type: 'text', text: 'thread root', marks: [{ type: 'bold' }] },
        { type: 'text', text: '.' },
      ],
    },
    {
      type: 'heading',
      attrs: { level: 2, section: 'discussion' },
      content: [{ type: 'text', text: 'Discussion' }],
    },
    {
      type: 'heading',
      attrs: { level: 3, section: null },
      content: [{ type: 'text', text: 'Loads' }],
    },
    {
      type: 'opinion',
      attrs: { observations: [1], assumptions: '' },
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: 'A snatch   load started it.' }] },
      ],
    },
  ],
}

describe('the section of a quoted passage', () => {
  it('finds a passage across marks, in the section heading before it', () => {
    expect(sectionOfQuote(doc, 'from the thread root')).toBe('summary')
  })

  it('looks inside opinions, keeps the section past an author’s own heading, ignores spacing', () => {
    expect(sectionOfQuote(doc, 'snatch load\nstarted')).toBe('discussion')
  })

  it('answers null for a passage that is not in the draft, or an empty one', () => {
    expect(sectionOfQuote(doc, 'overload')).toBeNull()
    expect(sectionOfQuote(doc, '   ')).toBeNull()
  })
})
