import type { LiveBlockKind } from './live-blocks'
import type { SectionKey } from './sections'

/**
 * The findings draft as the editor (tiptap) writes it: ProseMirror JSON limited to the nodes,
 * marks and attributes below. Anything else is refused by `checkDocument`, so the stored JSON and
 * everything rendered from it hold only what this file names.
 */
export type Mark =
  | { type: 'bold' }
  | { type: 'italic' }
  | { type: 'subscript' }
  | { type: 'superscript' }
  | { type: 'link'; attrs: { href: string } }

export interface TextNode {
  type: 'text'
  text: string
  marks?: Mark[]
}
export interface HardBreak {
  type: 'hardBreak'
}
/** "Figure n" in the text, numbered with the figure it points to. */
export interface FigureRef {
  type: 'figureRef'
  attrs: { figureId: string }
}
export type Inline = TextNode | HardBreak | FigureRef

export interface Paragraph {
  type: 'paragraph'
  content?: Inline[]
}
export interface Heading {
  type: 'heading'
  /** `section` marks the template's section headings; a heading the author adds has none */
  attrs: { level: 1 | 2 | 3 | 4; section: SectionKey | null }
  content?: Inline[]
}
export interface ListItem {
  type: 'listItem'
  content: (Paragraph | BulletList | OrderedList)[]
}
export interface BulletList {
  type: 'bulletList'
  content: ListItem[]
}
export interface OrderedList {
  type: 'orderedList'
  attrs: { start: number }
  content: ListItem[]
}
export interface TableCell {
  type: 'tableCell' | 'tableHeader'
  attrs: { colspan: number; rowspan: number }
  content: Paragraph[]
}
export interface TableRow {
  type: 'tableRow'
  content: TableCell[]
}
export interface Table {
  type: 'table'
  content: TableRow[]
}
/** A case photo's figure export (marks and scale bar drawn in) with its caption. */
export interface Figure {
  type: 'figure'
  attrs: { figureId: string; photoId: number; caption: string }
}
export interface LiveBlock {
  type: 'liveBlock'
  attrs: { kind: LiveBlockKind }
}
/** An opinion, citing the observations (their numbers n of `O-n`) it rests on. */
export interface Opinion {
  type: 'opinion'
  attrs: { observations: number[]; assumptions: string }
  content: Paragraph[]
}
export type Block =
  Paragraph | Heading | BulletList | OrderedList | Table | Figure | LiveBlock | Opinion
export interface FindingsDocument {
  type: 'doc'
  content: Block[]
}

/** A draft of about 300 pages of text; the stored JSON is refused above this. */
export const MAX_DOCUMENT_BYTES = 2 * 1024 * 1024
export const MAX_DOCUMENT_NODES = 50_000
export const MAX_DOCUMENT_DEPTH = 16
