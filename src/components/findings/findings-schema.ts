import type { Extensions } from '@tiptap/core'
import { Heading } from '@tiptap/extension-heading'
import { ListItem } from '@tiptap/extension-list'
import { Subscript } from '@tiptap/extension-subscript'
import { Superscript } from '@tiptap/extension-superscript'
import { Table, TableCell, TableHeader, TableRow } from '@tiptap/extension-table'
import { StarterKit } from '@tiptap/starter-kit'
import { isSafeHref } from '../../../shared/findings/check-document'
import { isSectionKey } from '../../../shared/findings/sections'
import { Figure, FigureRef, LiveBlock, Opinion } from './nodes/findings-nodes'

/** Template headings carry their report section; a heading split in two leaves it on the first. */
const SectionHeading = Heading.extend({
  addAttributes() {
    return {
      ...this.parent?.(),
      section: {
        default: null,
        keepOnSplit: false,
        parseHTML: (element: HTMLElement) => {
          const section = element.getAttribute('data-section')
          return isSectionKey(section) ? section : null
        },
        renderHTML: (attrs: { section: string | null }) =>
          attrs.section ? { 'data-section': attrs.section } : {},
      },
    }
  },
}).configure({ levels: [1, 2, 3, 4] })

// The document contract (shared/findings/document.ts) allows only paragraphs and lists in a list
// item and paragraphs in a table cell; the editor holds to it, so every save is accepted.
const PlainListItem = ListItem.extend({
  content: 'paragraph (paragraph | bulletList | orderedList)*',
})
const PlainCell = TableCell.extend({ content: 'paragraph+' })
const PlainHeaderCell = TableHeader.extend({ content: 'paragraph+' })

/** The editor's nodes and marks, exactly those of the findings document contract, without views. */
export function findingsSchemaExtensions(): Extensions {
  return [
    StarterKit.configure({
      blockquote: false,
      code: false,
      codeBlock: false,
      horizontalRule: false,
      strike: false,
      underline: false,
      heading: false,
      listItem: false,
      link: {
        openOnClick: false,
        autolink: true,
        defaultProtocol: 'https',
        isAllowedUri: (url) => isSafeHref(url),
        HTMLAttributes: { rel: 'noopener noreferrer nofollow', target: null },
      },
    }),
    SectionHeading,
    PlainListItem,
    Subscript,
    Superscript,
    Table.configure({ resizable: false }),
    TableRow,
    PlainHeaderCell,
    PlainCell,
    Figure,
    FigureRef,
    LiveBlock,
    Opinion,
  ]
}
