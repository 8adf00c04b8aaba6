import { describe, expect, it } from 'vitest'
import { checkDocument } from '../../shared/findings/check-document'
import type { Block, FindingsDocument } from '../../shared/findings/document'
import { figureNumbers } from '../../shared/findings/figures'
import { findingsFlags } from '../../shared/findings/flags'
import { draftFigureSrc, renderFindingsHtml } from '../../shared/findings/render-html'
import { findingsTemplate } from '../../shared/findings/template'

const figure = (figureId: string): Block => ({
  type: 'figure',
  attrs: { figureId, photoId: 1, caption: `Photo ${figureId}` },
})
const section = (key: 'discussion' | 'summary'): Block => ({
  type: 'heading',
  attrs: { level: 2, section: key },
  content: [{ type: 'text', text: key }],
})
const refTo = (figureId: string): Block => ({
  type: 'paragraph',
  content: [
    { type: 'text', text: 'see ' },
    { type: 'figureRef', attrs: { figureId } },
  ],
})
const opinion = (observations: number[]): Block => ({
  type: 'opinion',
  attrs: { observations, assumptions: '' },
  content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Fatigue.' }] }],
})
const doc = (...content: Block[]): FindingsDocument => ({ type: 'doc', content })
const html = (d: FindingsDocument) =>
  renderFindingsHtml(d, { figureSrc: draftFigureSrc, liveBlock: () => null })

describe('figure numbering', () => {
  it('numbers figures in the order of the text, inside lists and tables too', () => {
    const nested: Block = {
      type: 'bulletList',
      content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }],
    }
    const numbers = figureNumbers(doc(figure('a'), nested, figure('b'), figure('c')))
    expect([...numbers]).toEqual([
      ['a', 1],
      ['b', 2],
      ['c', 3],
    ])
  })

  it('renumbers a figure and its cross-reference when another is inserted above it', () => {
    const before = doc(figure('first'), refTo('first'))
    expect(html(before)).toContain('>Figure 1</a>')
    const after = doc(figure('inserted'), figure('first'), refTo('first'))
    expect(html(after)).toContain('Figure 2. Photo first')
    expect(html(after)).toContain('>Figure 2</a>')
    expect(html(after)).toContain('Figure 1. Photo inserted')
  })

  it('shows a reference to a removed figure as "Figure ?" and flags it', () => {
    const d = doc(refTo('gone'))
    expect(html(d)).toContain('>Figure ?</a>')
    expect(findingsFlags(d).map((f) => f.kind)).toEqual(['figure_reference_dangling'])
  })
})

describe('opinions and the observations they cite', () => {
  it('flags an opinion that cites no observation, not one that cites two', () => {
    const flags = findingsFlags(doc(section('discussion'), opinion([]), opinion([1, 2])))
    expect(flags).toHaveLength(1)
    expect(flags[0]).toMatchObject({ kind: 'opinion_uncited', subject: '1' })
  })

  it('flags an opinion placed among the facts, and one citing a withdrawn observation', () => {
    const flags = findingsFlags(doc(section('summary'), opinion([3])), new Set([3]))
    expect(flags.map((f) => f.kind)).toEqual([
      'opinion_outside_reasoning',
      'opinion_cites_withdrawn',
    ])
  })
})

describe('checking a draft', () => {
  it('accepts the template and returns it unchanged', () => {
    const checked = checkDocument(findingsTemplate())
    expect(checked).toEqual({ ok: true, doc: findingsTemplate() })
  })

  it('says where an unknown element is', () => {
    const checked = checkDocument({
      type: 'doc',
      content: [{ type: 'paragraph' }, { type: 'bulletList', content: [{ type: 'iframe' }] }],
    })
    expect(checked).toEqual({
      ok: false,
      issue: { path: 'content.1.content.0.type', message: '"iframe" is not allowed here.' },
    })
  })

  it('refuses nesting deeper than a real draft needs', () => {
    let list: object = { type: 'paragraph' }
    for (let i = 0; i < 20; i++)
      list = { type: 'bulletList', content: [{ type: 'listItem', content: [list] }] }
    const checked = checkDocument({ type: 'doc', content: [list] })
    expect(checked.ok).toBe(false)
  })
})
