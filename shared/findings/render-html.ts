import { isSafeHref } from './check-document'
import type { Block, Figure, FindingsDocument, Inline, Mark, Opinion, TableCell } from './document'
import { figureLabel, figureNumbers } from './figures'
import { LIVE_BLOCK_TITLES, type LiveBlockKind, type LiveBlockSnapshot } from './live-blocks'

export interface RenderContext {
  /** where the figure's image is served: a draft shows the photo's figure export */
  figureSrc: (figure: Figure) => string
  /** the live block's data, or null while it cannot be read */
  liveBlock: (kind: LiveBlockKind) => LiveBlockSnapshot | null
}

export const draftFigureSrc = (figure: Figure) => `/api/photos/${figure.attrs.photoId}/figure`

const ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
}
export const escapeHtml = (value: string) => value.replace(/[&<>"']/g, (c) => ESCAPES[c] ?? c)

/** Only the server's own paths for the case's images: never another host, data: or script. */
const OWN_IMAGE = /^\/api\/[A-Za-z0-9/_-]+$/

const MARK_TAGS: Record<Exclude<Mark['type'], 'link'>, string> = {
  bold: 'strong',
  italic: 'em',
  subscript: 'sub',
  superscript: 'sup',
}

function marked(html: string, marks: readonly Mark[] = []): string {
  let out = html
  for (const mark of marks) {
    if (mark.type === 'link') {
      if (isSafeHref(mark.attrs.href))
        out = `<a href="${escapeHtml(mark.attrs.href)}" rel="noopener noreferrer nofollow">${out}</a>`
    } else {
      const tag = MARK_TAGS[mark.type]
      if (tag) out = `<${tag}>${out}</${tag}>`
    }
  }
  return out
}

class Renderer {
  private readonly numbers: Map<string, number>

  constructor(
    doc: FindingsDocument,
    private readonly context: RenderContext,
  ) {
    this.numbers = figureNumbers(doc)
  }

  inline(node: Inline): string {
    if (node.type === 'text') return marked(escapeHtml(node.text), node.marks)
    if (node.type === 'hardBreak') return '<br>'
    if (node.type === 'figureRef') {
      const id = escapeHtml(node.attrs.figureId)
      return `<a class="figure-ref" href="#figure-${id}">${figureLabel(this.numbers, node.attrs.figureId)}</a>`
    }
    return ''
  }

  inlines(nodes: readonly Inline[] = []): string {
    return nodes.map((n) => this.inline(n)).join('')
  }

  figure(figure: Figure): string {
    const label = figureLabel(this.numbers, figure.attrs.figureId)
    const caption = `${label}. ${escapeHtml(figure.attrs.caption)}`
    const src = this.context.figureSrc(figure)
    const image = OWN_IMAGE.test(src) ? `<img src="${escapeHtml(src)}" alt="${caption}">` : ''
    const id = escapeHtml(figure.attrs.figureId)
    return `<figure class="report-figure" id="figure-${id}">${image}<figcaption>${caption}</figcaption></figure>`
  }

  liveBlock(kind: LiveBlockKind): string {
    const data = this.context.liveBlock(kind)
    const title = escapeHtml(data?.title ?? LIVE_BLOCK_TITLES[kind])
    if (!data || data.rows.length === 0)
      return `<section class="live-block" data-kind="${kind}"><h4>${title}</h4><p class="live-block-empty">Nothing recorded yet.</p></section>`
    const head = data.columns.map((c) => `<th>${escapeHtml(c)}</th>`).join('')
    const body = data.rows
      .map((row) => `<tr>${row.map((v) => `<td>${escapeHtml(v)}</td>`).join('')}</tr>`)
      .join('')
    const notes = data.notes.map((n) => `<p class="live-block-note">${escapeHtml(n)}</p>`).join('')
    return `<section class="live-block" data-kind="${kind}"><h4>${title}</h4><table><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>${notes}</section>`
  }

  opinion(opinion: Opinion): string {
    const cited = opinion.attrs.observations.map((n) => `O-${n}`).join(', ')
    const basis = cited ? `Opinion, based on ${cited}` : 'Opinion (cites no observation)'
    const assumptions = opinion.attrs.assumptions
      ? `<p class="opinion-assumptions">Assumptions: ${escapeHtml(opinion.attrs.assumptions)}</p>`
      : ''
    const body = opinion.content.map((p) => this.block(p)).join('')
    return `<aside class="opinion"><p class="opinion-basis">${basis}</p>${body}${assumptions}</aside>`
  }

  cell(cell: TableCell): string {
    const tag = cell.type === 'tableHeader' ? 'th' : 'td'
    const span =
      (cell.attrs.colspan > 1 ? ` colspan="${cell.attrs.colspan}"` : '') +
      (cell.attrs.rowspan > 1 ? ` rowspan="${cell.attrs.rowspan}"` : '')
    return `<${tag}${span}>${cell.content.map((p) => this.block(p)).join('')}</${tag}>`
  }

  block(block: Block | { type: string; [key: string]: unknown }): string {
    const node = block as Block
    switch (node.type) {
      case 'paragraph':
        return `<p>${this.inlines(node.content)}</p>`
      case 'heading': {
        const level = Math.min(Math.max(Number(node.attrs.level) || 2, 1), 4)
        return `<h${level}>${this.inlines(node.content)}</h${level}>`
      }
      case 'bulletList':
      case 'orderedList': {
        const items = node.content
          .map((item) => `<li>${item.content.map((b) => this.block(b)).join('')}</li>`)
          .join('')
        if (node.type === 'bulletList') return `<ul>${items}</ul>`
        const start = Number(node.attrs.start) || 1
        return start === 1 ? `<ol>${items}</ol>` : `<ol start="${start}">${items}</ol>`
      }
      case 'table':
        return `<table>${node.content
          .map((row) => `<tr>${row.content.map((c) => this.cell(c)).join('')}</tr>`)
          .join('')}</table>`
      case 'figure':
        return this.figure(node)
      case 'liveBlock':
        return this.liveBlock(node.attrs.kind)
      case 'opinion':
        return this.opinion(node)
      default:
        return ''
    }
  }
}

/**
 * The draft as HTML for a reader. Built only from a checked document: every text is escaped,
 * every tag and attribute comes from here, so nothing a client wrote can become markup.
 */
export function renderFindingsHtml(doc: FindingsDocument, context: RenderContext): string {
  const renderer = new Renderer(doc, context)
  return doc.content.map((block) => renderer.block(block)).join('')
}
