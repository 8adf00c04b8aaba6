import { getSchema } from '@tiptap/core'
import { describe, expect, it } from 'vitest'
import { findingsSchemaExtensions } from '../../src/components/findings/findings-schema'
import { checkDocument } from '../../shared/findings/check-document'
import type { FindingsDocument } from '../../shared/findings/document'
import { findingsTemplate } from '../../shared/findings/template'

const schema = getSchema(findingsSchemaExtensions())

/** What the editor makes of a stored draft and writes back, as the server then keeps it. */
function throughEditor(doc: unknown): FindingsDocument {
  const node = schema.nodeFromJSON(doc)
  node.check() // the editor's own content rules
  const checked = checkDocument(node.toJSON())
  if (!checked.ok) throw new Error(`${checked.issue.path}: ${checked.issue.message}`)
  return checked.doc
}

const text = (value: string, marks?: object[]) => ({
  type: 'text',
  text: value,
  ...(marks ? { marks } : {}),
})
const para = (...content: object[]) => ({ type: 'paragraph', content })

/** A draft using every node, mark and attribute of the contract. */
const EVERYTHING = {
  type: 'doc',
  content: [
    { type: 'heading', attrs: { level: 2, section: 'discussion' }, content: [text('Discussion')] },
    { type: 'heading', attrs: { level: 4, section: null }, content: [text('Own heading')] },
    para(
      text('σ', [{ type: 'bold' }, { type: 'italic' }]),
      text('max', [{ type: 'subscript' }]),
      text('2', [{ type: 'superscript' }]),
      { type: 'hardBreak' },
      text('see', [{ type: 'link', attrs: { href: 'https://example.org/a' } }]),
      { type: 'figureRef', attrs: { figureId: 'fig-1' } },
    ),
    { type: 'figure', attrs: { figureId: 'fig-1', photoId: 7, caption: 'Fracture face' } },
    { type: 'liveBlock', attrs: { kind: 'tensile_results' } },
    {
      type: 'opinion',
      attrs: { observations: [1, 3], assumptions: 'Loads as recorded' },
      content: [para(text('Fatigue.'))],
    },
    {
      type: 'orderedList',
      attrs: { start: 3 },
      content: [
        {
          type: 'listItem',
          content: [
            para(text('one')),
            { type: 'bulletList', content: [{ type: 'listItem', content: [para(text('two'))] }] },
          ],
        },
      ],
    },
    {
      type: 'table',
      content: [
        {
          type: 'tableRow',
          content: [
            { type: 'tableHeader', attrs: { colspan: 2, rowspan: 1 }, content: [para(text('Rm'))] },
          ],
        },
        {
          type: 'tableRow',
          content: [
            { type: 'tableCell', attrs: { colspan: 1, rowspan: 1 }, content: [para(text('812'))] },
            {
              type: 'tableCell',
              attrs: { colspan: 1, rowspan: 1 },
              content: [{ type: 'paragraph' }],
            },
          ],
        },
      ],
    },
  ],
}

describe('the editor’s schema and the document contract', () => {
  it('carries every node, mark and attribute of the contract through the editor unchanged', () => {
    const stored = checkDocument(EVERYTHING)
    expect(stored.ok).toBe(true)
    if (stored.ok) expect(throughEditor(stored.doc)).toEqual(stored.doc)
  })

  it('keeps the template’s section headings, so opinions are placed by section', () => {
    const template = findingsTemplate()
    const after = throughEditor(template)
    expect(after).toEqual(template)
    const sections = after.content.flatMap((b) => (b.type === 'heading' ? [b.attrs.section] : []))
    expect(sections).toContain('conclusions')
  })

  it('refuses what the contract refuses: tables in list items, headings in cells, unknown marks', () => {
    const tableInItem = {
      type: 'doc',
      content: [
        {
          type: 'bulletList',
          content: [
            { type: 'listItem', content: [para(text('x')), { type: 'table', content: [] }] },
          ],
        },
      ],
    }
    expect(() => throughEditor(tableInItem)).toThrow()
    const headingInCell = {
      type: 'doc',
      content: [
        {
          type: 'table',
          content: [
            {
              type: 'tableRow',
              content: [
                {
                  type: 'tableCell',
                  content: [{ type: 'heading', attrs: { level: 2 }, content: [text('x')] }],
                },
              ],
            },
          ],
        },
      ],
    }
    expect(() => throughEditor(headingInCell)).toThrow()
    expect(() =>
      throughEditor({ type: 'doc', content: [para(text('x', [{ type: 'strike' }]))] }),
    ).toThrow()
    expect(() =>
      throughEditor({ type: 'doc', content: [{ type: 'blockquote', content: [] }] }),
    ).toThrow()
  })

  it('has no node or mark the server would refuse', () => {
    const contract = [
      'doc',
      'text',
      'paragraph',
      'heading',
      'bulletList',
      'orderedList',
      'listItem',
      'hardBreak',
      'table',
      'tableRow',
      'tableCell',
      'tableHeader',
      'figure',
      'figureRef',
      'liveBlock',
      'opinion',
    ]
    expect(Object.keys(schema.nodes).sort()).toEqual([...contract].sort())
    expect(Object.keys(schema.marks).sort()).toEqual([
      'bold',
      'italic',
      'link',
      'subscript',
      'superscript',
    ])
  })
})
