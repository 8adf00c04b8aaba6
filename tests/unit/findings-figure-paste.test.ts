import { getSchema } from '@tiptap/core'
import { Slice } from '@tiptap/pm/model'
import { describe, expect, it } from 'vitest'
import { figureIdsIn, withFreshFigureIds } from '../../src/components/findings/figure-ids'
import { findingsSchemaExtensions } from '../../src/components/findings/findings-schema'
import type { FindingsDocument } from '../../shared/findings/document'
import { figureNumbers } from '../../shared/findings/figures'

const schema = getSchema(findingsSchemaExtensions())
const figure = (figureId: string, caption = 'Fracture face') => ({
  type: 'figure',
  attrs: { figureId, photoId: 7, caption },
})
const draft = (...content: object[]) => schema.nodeFromJSON({ type: 'doc', content })
const sliceOf = (...content: object[]) => new Slice(draft(...content).content, 0, 0)
const figureIdsOf = (slice: Slice) => {
  const ids: string[] = []
  slice.content.descendants((node) => {
    if (node.type.name === 'figure') ids.push(node.attrs.figureId as string)
  })
  return ids
}

describe('pasting figures into a draft', () => {
  it('gives a copied figure its own id, so it gets its own number', () => {
    const doc = draft(figure('fig-a'))
    let n = 0
    const pasted = withFreshFigureIds(
      sliceOf(figure('fig-a', 'Copy')),
      figureIdsIn(doc),
      () => `fig-new-${++n}`,
    )
    expect(figureIdsOf(pasted)).toEqual(['fig-new-1'])
    // the caption and photo come along unchanged
    expect(pasted.content.firstChild?.attrs).toMatchObject({ photoId: 7, caption: 'Copy' })
    const both = draft(figure('fig-a'), ...pasted.content.toJSON())
    expect(figureNumbers(both.toJSON() as FindingsDocument).size).toBe(2)
  })

  it('keeps the id of a figure cut and pasted back, and of one new to the draft', () => {
    const pasted = withFreshFigureIds(
      sliceOf(figure('fig-moved')),
      figureIdsIn(draft(figure('fig-b'))),
    )
    expect(figureIdsOf(pasted)).toEqual(['fig-moved'])
  })

  it('tells apart two copies of one figure within the same paste', () => {
    const pasted = withFreshFigureIds(sliceOf(figure('fig-c'), figure('fig-c')), new Set())
    const ids = figureIdsOf(pasted)
    expect(ids[0]).toBe('fig-c')
    expect(ids[1]).not.toBe('fig-c')
    expect(ids[1]).toMatch(/^fig-[a-z0-9]+$/)
  })
})
