import type { StyleDictionary } from 'pdfmake/interfaces'

/** A4 in points, with room for the running header and footer. */
export const PAGE = {
  width: 595.28,
  height: 841.89,
  margins: [56, 78, 56, 70] as [number, number, number, number],
}
export const CONTENT_WIDTH = PAGE.width - PAGE.margins[0] - PAGE.margins[2]
export const CONTENT_HEIGHT = PAGE.height - PAGE.margins[1] - PAGE.margins[3]

/** The report's own calm palette: dark slate text, a teal accent, a warm red only for the draft. */
export const INK = {
  text: '#1f2a33',
  muted: '#5b6770',
  accent: '#1d5c63',
  rule: '#b9c4c9',
  shade: '#eef3f4',
  opinion: '#f7f1e3',
  opinionRule: '#b58a2b',
  link: '#1d5c63',
  draft: '#b03a2e',
}

export const STYLES: StyleDictionary = {
  body: { fontSize: 10, lineHeight: 1.25, margin: [0, 0, 0, 6] },
  h1: { fontSize: 17, bold: true, color: INK.accent, margin: [0, 14, 0, 8] },
  h2: { fontSize: 13.5, bold: true, color: INK.accent, margin: [0, 14, 0, 6] },
  h3: { fontSize: 11.5, bold: true, margin: [0, 10, 0, 4] },
  h4: { fontSize: 10.5, bold: true, margin: [0, 8, 0, 4] },
  listItem: { margin: [0, 0, 0, 2] },
  cell: { margin: [0, 0, 0, 0] },
  caption: { fontSize: 9, italics: true, color: INK.muted, margin: [0, 4, 0, 10] },
  table: { fontSize: 8.5, lineHeight: 1.15, margin: [0, 2, 0, 8] },
  tableHeader: { bold: true, fillColor: INK.shade },
  note: { fontSize: 8.5, color: INK.muted, margin: [0, 0, 0, 3] },
  label: { fontSize: 9, color: INK.muted },
  running: { fontSize: 8, color: INK.muted },
}
