import { Fragment, Slice, type Node as PmNode } from '@tiptap/pm/model'

/** A new figure's id: unique within a draft (the numbering follows the text, not the id). */
export const newFigureId = (): string =>
  `fig-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 7)}`

/** The figure ids a document already uses. */
export function figureIdsIn(doc: PmNode): Set<string> {
  const ids = new Set<string>()
  doc.descendants((node) => {
    if (node.type.name === 'figure' && node.attrs.figureId) ids.add(node.attrs.figureId as string)
  })
  return ids
}

/**
 * A pasted copy of a figure would keep its original's id, and both would then share one number:
 * each pasted figure whose id the draft (or the paste before it) already uses gets a new id. A
 * figure that was cut and pasted back keeps its id, so references to it still follow it.
 */
export function withFreshFigureIds(
  slice: Slice,
  taken: Set<string>,
  fresh: () => string = newFigureId,
): Slice {
  const used = new Set(taken)
  const renumber = (fragment: Fragment): Fragment => {
    const nodes: PmNode[] = []
    fragment.forEach((node) => {
      if (node.type.name === 'figure') {
        let id = node.attrs.figureId as string | null
        if (!id || used.has(id)) id = fresh()
        used.add(id)
        nodes.push(node.type.create({ ...node.attrs, figureId: id }, node.content, node.marks))
      } else {
        nodes.push(node.copy(renumber(node.content)))
      }
    })
    return Fragment.fromArray(nodes)
  }
  return new Slice(renumber(slice.content), slice.openStart, slice.openEnd)
}
