import { mergeAttributes, Node } from '@tiptap/core'
import { Plugin } from '@tiptap/pm/state'
import { figureIdsIn, withFreshFigureIds } from '../figure-ids'
import { isLiveBlockKind } from '../../../../shared/findings/live-blocks'

// The schema of the draft's own nodes, without their views, so tests can check it without a
// browser; `findings-extensions.ts` adds the Vue views.

const dataAttr = (name: string, parse: (value: string | null) => unknown = (v) => v) => ({
  parseHTML: (element: HTMLElement) => parse(element.getAttribute(`data-${name}`)),
  // the node's own renderHTML writes every attribute
  renderHTML: () => ({}),
})

const whole = (value: string | null) => {
  const n = Number(value)
  return Number.isInteger(n) && n > 0 ? n : null
}

/** A case photo's figure export with its caption; numbered by its place in the text. */
export const Figure = Node.create({
  name: 'figure',
  group: 'block',
  atom: true,
  draggable: true,
  selectable: true,
  addAttributes() {
    return {
      figureId: { default: null, ...dataAttr('figure-id') },
      photoId: { default: null, ...dataAttr('photo-id', whole) },
      caption: { default: '', ...dataAttr('caption', (v) => v ?? '') },
    }
  },
  parseHTML: () => [{ tag: 'figure[data-figure-id]' }],
  addProseMirrorPlugins: () => [
    new Plugin({
      props: {
        transformPasted: (slice, view) => withFreshFigureIds(slice, figureIdsIn(view.state.doc)),
      },
    }),
  ],
  renderHTML: ({ node }) => [
    'figure',
    mergeAttributes({
      'data-figure-id': node.attrs.figureId,
      'data-photo-id': node.attrs.photoId,
      'data-caption': node.attrs.caption,
    }),
  ],
})

/** "Figure n" in the text, following its figure's number. */
export const FigureRef = Node.create({
  name: 'figureRef',
  group: 'inline',
  inline: true,
  atom: true,
  selectable: true,
  addAttributes() {
    return { figureId: { default: null, ...dataAttr('figure-ref') } }
  },
  parseHTML: () => [{ tag: 'span[data-figure-ref]' }],
  renderHTML: ({ node }) => ['span', { 'data-figure-ref': node.attrs.figureId }],
  renderText: () => 'Figure',
})

/** The case's current data of one kind: tensile results, service history, items. */
export const LiveBlock = Node.create({
  name: 'liveBlock',
  group: 'block',
  atom: true,
  draggable: true,
  selectable: true,
  addAttributes() {
    return {
      kind: {
        default: 'tensile_results',
        ...dataAttr('live-block', (v) => (isLiveBlockKind(v) ? v : 'tensile_results')),
      },
    }
  },
  parseHTML: () => [{ tag: 'section[data-live-block]' }],
  renderHTML: ({ node }) => ['section', { 'data-live-block': node.attrs.kind }],
})

/** An opinion: its paragraphs, the observations it cites and the assumptions it makes. */
export const Opinion = Node.create({
  name: 'opinion',
  group: 'block',
  content: 'paragraph+',
  defining: true,
  isolating: true,
  addAttributes() {
    return {
      observations: {
        default: [],
        parseHTML: (element: HTMLElement) =>
          (element.getAttribute('data-observations') ?? '')
            .split(',')
            .map((v) => whole(v))
            .filter((n): n is number => n !== null),
        renderHTML: () => ({}),
      },
      assumptions: { default: '', ...dataAttr('assumptions', (v) => v ?? '') },
    }
  },
  parseHTML: () => [{ tag: 'aside[data-opinion]' }],
  renderHTML: ({ node }) => [
    'aside',
    {
      'data-opinion': '',
      'data-observations': (node.attrs.observations as number[]).join(','),
      'data-assumptions': node.attrs.assumptions,
    },
    0,
  ],
})
