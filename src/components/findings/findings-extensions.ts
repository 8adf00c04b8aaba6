import type { Extensions } from '@tiptap/core'
import { VueNodeViewRenderer } from '@tiptap/vue-3'
import { findingsSchemaExtensions } from './findings-schema'
import FigureNodeView from './nodes/FigureNodeView.vue'
import FigureRefNodeView from './nodes/FigureRefNodeView.vue'
import LiveBlockNodeView from './nodes/LiveBlockNodeView.vue'
import OpinionNodeView from './nodes/OpinionNodeView.vue'

const VIEWS = {
  figure: FigureNodeView,
  figureRef: FigureRefNodeView,
  liveBlock: LiveBlockNodeView,
  opinion: OpinionNodeView,
}

/** The editor's extensions, the draft's own nodes shown by their Vue views. */
export function findingsExtensions(): Extensions {
  return findingsSchemaExtensions().map((extension) => {
    const view = VIEWS[extension.name as keyof typeof VIEWS]
    return view ? extension.extend({ addNodeView: () => VueNodeViewRenderer(view) }) : extension
  })
}
