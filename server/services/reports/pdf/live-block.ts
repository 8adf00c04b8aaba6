import type { Content, TableCell } from 'pdfmake/interfaces'
import {
  LIVE_BLOCK_TITLES,
  type LiveBlockKind,
  type LiveBlockSnapshot,
} from '../../../../shared/findings/live-blocks'
import { TABLE_LAYOUT } from './table-layout'
import { runs } from './text-runs'

/** A results table as it was read (values already carry their units), its notes under it. */
export function liveBlockContent(
  kind: LiveBlockKind,
  data: LiveBlockSnapshot | undefined,
): Content {
  const title: Content = {
    text: runs(data?.title ?? LIVE_BLOCK_TITLES[kind]),
    style: 'h4',
    headlineLevel: 4,
  }
  if (!data || data.rows.length === 0)
    return { stack: [title, { text: runs('Nothing recorded yet.'), style: 'note' }] }
  const header: TableCell[] = data.columns.map((column) => ({
    text: runs(column),
    style: 'tableHeader',
  }))
  const body: TableCell[][] = data.rows.map((row) =>
    data.columns.map((_, index) => ({ text: runs(row[index] ?? '') })),
  )
  const notes = data.notes.map((note): Content => ({ text: runs(note), style: 'note' }))
  return {
    stack: [
      title,
      {
        table: { headerRows: 1, widths: data.columns.map(() => 'auto'), body: [header, ...body] },
        layout: TABLE_LAYOUT,
        style: 'table',
      },
      ...notes,
    ],
    margin: [0, 0, 0, 8],
  }
}
