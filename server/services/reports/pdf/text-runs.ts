import type { ContentText, Style } from 'pdfmake/interfaces'
import { isSafeHref } from '../../../../shared/findings/check-document'
import type { Inline, Mark } from '../../../../shared/findings/document'
import { figureLabel } from '../../../../shared/findings/figures'
import { fontRuns } from './fonts'
import { INK } from './styles'

type RunStyle = Pick<Style, 'bold' | 'italics' | 'sup' | 'sub' | 'color' | 'decoration'> & {
  link?: string
}

/** Text in runs of one font each, so every character is set in a font that has its glyph. */
export function runs(text: string, style: RunStyle = {}): ContentText[] {
  return fontRuns(text).map((run) => ({ text: run.text, font: run.font, ...style }))
}

function styleOf(marks: readonly Mark[] = []): RunStyle {
  const style: RunStyle = {}
  for (const mark of marks) {
    if (mark.type === 'bold') style.bold = true
    else if (mark.type === 'italic') style.italics = true
    else if (mark.type === 'subscript') style.sub = true
    else if (mark.type === 'superscript') style.sup = true
    else if (mark.type === 'link' && isSafeHref(mark.attrs.href)) {
      style.link = mark.attrs.href
      style.color = INK.link
      style.decoration = 'underline'
    }
  }
  return style
}

/** A paragraph's inline content: marks as styles, a figure reference as its current label. */
export function inlineRuns(nodes: readonly Inline[] = [], numbers: Map<string, number>) {
  const out: ContentText[] = []
  for (const node of nodes) {
    if (node.type === 'text') out.push(...runs(node.text, styleOf(node.marks)))
    else if (node.type === 'hardBreak') out.push({ text: '\n' })
    else if (node.type === 'figureRef') out.push(...runs(figureLabel(numbers, node.attrs.figureId)))
  }
  return out
}
