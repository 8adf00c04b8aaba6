import type { Content, ContentStack } from 'pdfmake/interfaces'
import type {
  Block,
  BulletList,
  FindingsDocument,
  ListItem,
  OrderedList,
  Paragraph,
  Table,
} from '../../../../shared/findings/document'
import { figureNumbers } from '../../../../shared/findings/figures'
import { figureBlock } from './figure-block'
import { liveBlockContent } from './live-block'
import { opinionBlock } from './opinion-block'
import { headerRowCount, spannedGrid, type SpanCell } from './table-grid'
import { inlineRuns } from './text-runs'
import type { ReportPdfInput } from './input'
import { TABLE_LAYOUT } from './table-layout'

/** Turns the issued (or draft) findings into pdfmake content, node by node. */
export class BlockWriter {
  readonly numbers: Map<string, number>

  constructor(private readonly input: ReportPdfInput) {
    this.numbers = figureNumbers(input.doc)
  }

  paragraph(node: Paragraph, style = 'body'): Content {
    return { text: inlineRuns(node.content, this.numbers), style }
  }

  private list(node: BulletList | OrderedList): Content {
    const items = node.content.map((item: ListItem): ContentStack => ({
      stack: item.content.map((child) =>
        child.type === 'paragraph' ? this.paragraph(child, 'listItem') : this.list(child),
      ),
    }))
    if (node.type === 'bulletList') return { ul: items, style: 'body' }
    return { ol: items, start: Number(node.attrs.start) || 1, style: 'body' }
  }

  private table(node: Table): Content {
    const rows: SpanCell[][] = node.content.map((row) =>
      row.content.map((cell) => ({
        content: { stack: cell.content.map((p) => this.paragraph(p, 'cell')) },
        colSpan: cell.attrs.colspan,
        rowSpan: cell.attrs.rowspan,
        header: cell.type === 'tableHeader',
      })),
    )
    const { body, columns } = spannedGrid(rows)
    if (columns === 0) return { text: '' }
    return {
      table: { headerRows: headerRowCount(rows), widths: Array(columns).fill('*'), body },
      layout: TABLE_LAYOUT,
      style: 'table',
    }
  }

  block(node: Block): Content {
    switch (node.type) {
      case 'paragraph':
        return this.paragraph(node)
      case 'heading': {
        const level = Math.min(Math.max(Number(node.attrs.level) || 2, 1), 4)
        // headlineLevel lets the page-break rule keep a heading with the text under it
        return {
          text: inlineRuns(node.content, this.numbers),
          style: `h${level}`,
          headlineLevel: level,
        }
      }
      case 'bulletList':
      case 'orderedList':
        return this.list(node)
      case 'table':
        return this.table(node)
      case 'figure':
        return figureBlock(node, this.numbers, this.input.figures[node.attrs.figureId])
      case 'liveBlock':
        return liveBlockContent(node.attrs.kind, this.input.liveBlocks[node.attrs.kind])
      case 'opinion':
        return opinionBlock(node, (p) => this.paragraph(p))
      default:
        return { text: '' }
    }
  }

  document(doc: FindingsDocument = this.input.doc): Content[] {
    return doc.content.map((node) => this.block(node))
  }
}
