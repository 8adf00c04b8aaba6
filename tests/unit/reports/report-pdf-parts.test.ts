import { readFileSync } from 'node:fs'
import * as fontkit from 'fontkit'
import { describe, expect, it } from 'vitest'
import { createRequire } from 'node:module'
import {
  FONT_FAMILIES,
  fontFor,
  fontRuns,
  loadFontFiles,
} from '../../../server/services/reports/pdf/fonts'
import { sfntFromWoff } from '../../../server/services/reports/pdf/woff'
import { headerRowCount, spannedGrid } from '../../../server/services/reports/pdf/table-grid'

describe('the glyph-by-glyph font fallback', () => {
  it('sets text in Merriweather Sans and the symbols its subsets lack in DejaVu Sans', () => {
    expect(fontFor('a'.codePointAt(0) as number)).toBe('Text')
    // ± and µ are in Merriweather Sans' latin subset; σ, ε, ≤, ≥ and √ are not
    expect(fontFor(0xb1)).toBe('Text')
    expect(fontFor(0xb5)).toBe('Text')
    for (const symbol of 'σε≤≥√') expect(fontFor(symbol.codePointAt(0) as number)).toBe('Symbols')
    // Ł is in the latin-ext subset of Merriweather Sans
    expect(fontFor('Ł'.codePointAt(0) as number)).toBe('TextExt')
  })

  it('only ever picks a font that has the glyph, for every symbol a report prints', () => {
    for (const char of 'σεµ°±≤≥√ΔÅ–—‘’“”…×·²³') {
      const name = fontFor(char.codePointAt(0) as number)
      const bytes = loadFontFiles().get(FONT_FAMILIES[name].normal) as Buffer
      const font = fontkit.create(bytes) as fontkit.Font
      expect(font.hasGlyphForCodePoint(char.codePointAt(0) as number), char).toBe(true)
    }
  })

  it('cuts text into runs of one font, keeping every character in order', () => {
    const runs = fontRuns('σ ≤ 350 MPa')
    expect(runs.map((run) => run.text).join('')).toBe('σ ≤ 350 MPa')
    expect(runs).toEqual([
      { text: 'σ', font: 'Symbols' },
      { text: ' ', font: 'Text' },
      { text: '≤', font: 'Symbols' },
      { text: ' 350 MPa', font: 'Text' },
    ])
  })
})

describe('WOFF fonts unpacked for the PDF', () => {
  it('gives the same font as fontkit reads from the WOFF itself (W3C WOFF 1.0)', () => {
    const woff = readFileSync(
      createRequire(import.meta.url).resolve(
        '@fontsource/dejavu-sans/files/dejavu-sans-latin-400-normal.woff',
      ),
    )
    const sfnt = sfntFromWoff(woff)
    expect(sfnt.readUInt32BE(0)).toBe(0x00010000) // a TrueType outline font
    const fromWoff = fontkit.create(woff) as fontkit.Font
    const fromSfnt = fontkit.create(sfnt) as fontkit.Font
    expect(fromSfnt.numGlyphs).toBe(fromWoff.numGlyphs)
    expect(fromSfnt.postscriptName).toBe(fromWoff.postscriptName)
    const sigma = 'σ'.codePointAt(0) as number
    expect(fromSfnt.glyphForCodePoint(sigma).advanceWidth).toBe(
      fromWoff.glyphForCodePoint(sigma).advanceWidth,
    )
    expect(() => sfntFromWoff(Buffer.from('not a font at all, not at all'))).toThrow()
  })
})

describe('tables with spanned cells', () => {
  const cell = (name: string, colSpan = 1, rowSpan = 1, header = false) => ({
    content: { text: name },
    colSpan,
    rowSpan,
    header,
  })

  it('places cells after the places taken by spans from rows above and to the left', () => {
    // | A A | B |      A spans two columns
    // | C | D | E |    C spans two rows
    // | C | F | G |
    const rows = [
      [cell('A', 2, 1, true), cell('B', 1, 1, true)],
      [cell('C', 1, 2), cell('D'), cell('E')],
      [cell('F'), cell('G')],
    ]
    const { body, columns } = spannedGrid(rows)
    expect(columns).toBe(3)
    expect(body.map((row) => row.map((c) => ('text' in c ? c.text : '·')))).toEqual([
      ['A', '·', 'B'],
      ['C', 'D', 'E'],
      ['·', 'F', 'G'],
    ])
    expect(body[0]?.[0]).toMatchObject({ colSpan: 2, style: 'tableHeader' })
    expect(body[1]?.[0]).toMatchObject({ rowSpan: 2 })
    expect(headerRowCount(rows)).toBe(1)
  })

  it('cuts a row span that runs past the last row', () => {
    const { body } = spannedGrid([[cell('A', 1, 5), cell('B')]])
    expect(body[0]?.[0]).not.toHaveProperty('rowSpan')
  })
})
