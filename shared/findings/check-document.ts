import type { Block, FindingsDocument, Inline, Mark } from './document'
import { MAX_DOCUMENT_DEPTH, MAX_DOCUMENT_NODES } from './document'
import { isLiveBlockKind } from './live-blocks'
import { isSectionKey } from './sections'

export interface DocumentIssue {
  /** where in the JSON, e.g. `content.3.content.0.marks.1` */
  path: string
  message: string
}

export type DocumentCheck =
  { ok: true; doc: FindingsDocument } | { ok: false; issue: DocumentIssue }

class Refusal extends Error {
  constructor(
    readonly path: string,
    message: string,
  ) {
    super(message)
  }
}

type Json = Record<string, unknown>
type Content = 'blocks' | 'inline' | 'listItems' | 'listItemBody' | 'rows' | 'cells' | 'paragraphs'

const CONTENT_OF: Record<string, Content | null> = {
  doc: 'blocks',
  paragraph: 'inline',
  heading: 'inline',
  bulletList: 'listItems',
  orderedList: 'listItems',
  listItem: 'listItemBody',
  table: 'rows',
  tableRow: 'cells',
  tableCell: 'paragraphs',
  tableHeader: 'paragraphs',
  opinion: 'paragraphs',
  figure: null,
  liveBlock: null,
}

const ALLOWED_IN: Record<Content, readonly string[]> = {
  blocks: [
    'paragraph',
    'heading',
    'bulletList',
    'orderedList',
    'table',
    'figure',
    'liveBlock',
    'opinion',
  ],
  inline: ['text', 'hardBreak', 'figureRef'],
  listItems: ['listItem'],
  listItemBody: ['paragraph', 'bulletList', 'orderedList'],
  rows: ['tableRow'],
  cells: ['tableCell', 'tableHeader'],
  paragraphs: ['paragraph'],
}

const MAX_TEXT = 100_000
const MAX_ATTR_TEXT = 4_000
const FIGURE_ID = /^[A-Za-z0-9_-]{1,64}$/
/** Links go to web pages or mail addresses only: no script, data or relative URLs. */
const SAFE_HREF = /^(https?:\/\/[^\s<>"']+|mailto:[^\s<>"']+)$/i

const isObject = (value: unknown): value is Json =>
  typeof value === 'object' && value !== null && !Array.isArray(value)

const wholeInRange = (value: unknown, min: number, max: number): value is number =>
  typeof value === 'number' && Number.isInteger(value) && value >= min && value <= max

export const isSafeHref = (href: unknown): href is string =>
  typeof href === 'string' && href.length <= 2000 && SAFE_HREF.test(href)

function text(value: unknown, path: string, max: number): string {
  if (value === undefined || value === null) return ''
  if (typeof value !== 'string') throw new Refusal(path, 'Must be text.')
  if (value.length > max) throw new Refusal(path, `At most ${max} characters.`)
  return value
}

function mark(raw: unknown, path: string): Mark {
  if (!isObject(raw)) throw new Refusal(path, 'A mark must be an object.')
  const attrs = isObject(raw.attrs) ? raw.attrs : {}
  switch (raw.type) {
    case 'bold':
    case 'italic':
    case 'subscript':
    case 'superscript':
      return { type: raw.type }
    case 'link':
      if (!isSafeHref(attrs.href))
        throw new Refusal(`${path}.attrs.href`, 'A link must be an http, https or mailto address.')
      return { type: 'link', attrs: { href: attrs.href } }
    default:
      throw new Refusal(`${path}.type`, `Unknown mark "${String(raw.type)}".`)
  }
}

/** Only the attributes each node has, with their defaults; anything else the client sent is dropped. */
function attrsOf(type: string, raw: Json, path: string): Json | undefined {
  const attrs = isObject(raw.attrs) ? raw.attrs : {}
  const at = `${path}.attrs`
  switch (type) {
    case 'heading': {
      if (!wholeInRange(attrs.level, 1, 4))
        throw new Refusal(`${at}.level`, 'Heading level 1 to 4.')
      const section = attrs.section ?? null
      if (section !== null && !isSectionKey(section))
        throw new Refusal(`${at}.section`, 'Unknown report section.')
      return { level: attrs.level, section }
    }
    case 'orderedList': {
      const start = attrs.start ?? 1
      if (!wholeInRange(start, 0, 100_000)) throw new Refusal(`${at}.start`, 'A whole number.')
      return { start }
    }
    case 'tableCell':
    case 'tableHeader': {
      const colspan = attrs.colspan ?? 1
      const rowspan = attrs.rowspan ?? 1
      if (!wholeInRange(colspan, 1, 50) || !wholeInRange(rowspan, 1, 500))
        throw new Refusal(at, 'Cells span 1 to 50 columns and 1 to 500 rows.')
      return { colspan, rowspan }
    }
    case 'figure': {
      if (typeof attrs.figureId !== 'string' || !FIGURE_ID.test(attrs.figureId))
        throw new Refusal(`${at}.figureId`, 'A figure needs its id (letters, digits, - and _).')
      if (!wholeInRange(attrs.photoId, 1, 2 ** 31 - 1))
        throw new Refusal(`${at}.photoId`, 'A figure shows one of the case’s photos.')
      return {
        figureId: attrs.figureId,
        photoId: attrs.photoId,
        caption: text(attrs.caption, `${at}.caption`, MAX_ATTR_TEXT),
      }
    }
    case 'figureRef':
      if (typeof attrs.figureId !== 'string' || !FIGURE_ID.test(attrs.figureId))
        throw new Refusal(`${at}.figureId`, 'A figure reference needs the figure’s id.')
      return { figureId: attrs.figureId }
    case 'liveBlock':
      if (!isLiveBlockKind(attrs.kind)) throw new Refusal(`${at}.kind`, 'Unknown live block.')
      return { kind: attrs.kind }
    case 'opinion': {
      const cited = attrs.observations ?? []
      if (
        !Array.isArray(cited) ||
        cited.length > 200 ||
        !cited.every((n) => wholeInRange(n, 1, 2 ** 31 - 1))
      )
        throw new Refusal(`${at}.observations`, 'Observations are cited by their numbers.')
      const unique = [...new Set(cited as number[])].sort((a, b) => a - b)
      return {
        observations: unique,
        assumptions: text(attrs.assumptions, `${at}.assumptions`, MAX_ATTR_TEXT),
      }
    }
    default:
      return undefined
  }
}

interface Walk {
  nodes: number
}

function node(raw: unknown, allowed: readonly string[], path: string, depth: number, walk: Walk) {
  if (++walk.nodes > MAX_DOCUMENT_NODES)
    throw new Refusal(path, `A draft holds at most ${MAX_DOCUMENT_NODES} elements.`)
  if (depth > MAX_DOCUMENT_DEPTH) throw new Refusal(path, 'The draft is nested too deeply.')
  if (!isObject(raw)) throw new Refusal(path, 'Each element must be an object.')
  const type = raw.type
  if (typeof type !== 'string' || !allowed.includes(type))
    throw new Refusal(`${path}.type`, `"${String(type)}" is not allowed here.`)
  if (type === 'text') return textNode(raw, path)
  if (type === 'hardBreak') return { type }
  const out: Json = { type }
  const attrs = attrsOf(type, raw, path)
  if (attrs) out.attrs = attrs
  const kind = type === 'figureRef' ? null : CONTENT_OF[type]
  if (kind === 'inline' && raw.content === undefined) return out
  if (kind) {
    const content = raw.content ?? []
    if (!Array.isArray(content)) throw new Refusal(`${path}.content`, 'Content must be a list.')
    out.content = content.map((child, index) =>
      node(child, ALLOWED_IN[kind], `${path}.content.${index}`, depth + 1, walk),
    )
  } else if (raw.content !== undefined) {
    throw new Refusal(`${path}.content`, `"${type}" holds no content.`)
  }
  return out
}

function textNode(raw: Json, path: string): Inline {
  const value = text(raw.text, `${path}.text`, MAX_TEXT)
  if (value === '') throw new Refusal(`${path}.text`, 'A text element cannot be empty.')
  if (raw.marks === undefined) return { type: 'text', text: value }
  if (!Array.isArray(raw.marks) || raw.marks.length > 8)
    throw new Refusal(`${path}.marks`, 'Marks must be a short list.')
  const marks = raw.marks.map((m, index) => mark(m, `${path}.marks.${index}`))
  return marks.length ? { type: 'text', text: value, marks } : { type: 'text', text: value }
}

/**
 * Checks a draft sent by a client and returns it rebuilt from what is allowed: known nodes and
 * marks only (anything else refuses the whole draft), known attributes only (others dropped).
 */
export function checkDocument(raw: unknown): DocumentCheck {
  try {
    if (!isObject(raw) || raw.type !== 'doc')
      throw new Refusal('type', 'A findings draft is a document ("type": "doc").')
    const doc = node(raw, ['doc'], '', 0, { nodes: 0 }) as unknown as FindingsDocument
    return { ok: true, doc }
  } catch (error) {
    if (error instanceof Refusal)
      return { ok: false, issue: { path: error.path.replace(/^\./, ''), message: error.message } }
    throw error
  }
}

/** Every block in document order, descending into lists, tables and opinions. */
export function* blocksOf(doc: FindingsDocument): Generator<Block> {
  const stack: unknown[] = [...doc.content].reverse()
  while (stack.length) {
    const next = stack.pop() as { type: string; content?: unknown[] }
    yield next as Block
    if (next.content && next.type !== 'paragraph' && next.type !== 'heading')
      stack.push(...[...next.content].reverse())
  }
}

/** Every inline element in document order. */
export function* inlinesOf(doc: FindingsDocument): Generator<Inline> {
  for (const block of blocksOf(doc)) {
    if ((block.type === 'paragraph' || block.type === 'heading') && block.content)
      yield* block.content
  }
}
