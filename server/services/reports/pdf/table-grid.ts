import type { Content, TableCell } from 'pdfmake/interfaces'

export interface SpanCell {
  content: Content
  colSpan: number
  rowSpan: number
  header: boolean
}

/**
 * Lays cells with column and row spans onto a rectangular grid, as pdfmake wants it: every row
 * has a cell for every column, with empty stand-ins where a span covers the place.
 */
export function spannedGrid(rows: readonly SpanCell[][]): { body: TableCell[][]; columns: number } {
  const taken: boolean[][] = rows.map(() => [])
  const placed: { row: number; col: number; cell: SpanCell }[] = []
  let columns = 0
  rows.forEach((cells, r) => {
    let c = 0
    for (const cell of cells) {
      while (taken[r]?.[c]) c++
      const rowSpan = Math.max(1, Math.min(cell.rowSpan, rows.length - r))
      const colSpan = Math.max(1, cell.colSpan)
      for (let dr = 0; dr < rowSpan; dr++)
        for (let dc = 0; dc < colSpan; dc++) (taken[r + dr] as boolean[])[c + dc] = true
      placed.push({ row: r, col: c, cell: { ...cell, rowSpan, colSpan } })
      c += colSpan
      columns = Math.max(columns, c)
    }
  })
  for (const row of taken) columns = Math.max(columns, row.length)
  const body: TableCell[][] = rows.map(() => Array.from({ length: columns }, () => ({})))
  for (const { row, col, cell } of placed) {
    const target = body[row] as TableCell[]
    target[col] = {
      ...(cell.content as object),
      ...(cell.colSpan > 1 ? { colSpan: cell.colSpan } : {}),
      ...(cell.rowSpan > 1 ? { rowSpan: cell.rowSpan } : {}),
      ...(cell.header ? { style: 'tableHeader' } : {}),
    } as TableCell
  }
  return { body, columns }
}

/** The number of leading rows made only of header cells: repeated on each page the table spans. */
export function headerRowCount(rows: readonly SpanCell[][]): number {
  let count = 0
  for (const row of rows) {
    if (row.length > 0 && row.every((cell) => cell.header)) count++
    else break
  }
  return count
}
