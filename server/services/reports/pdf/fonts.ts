import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import * as fontkit from 'fontkit'

/*
 * Fonts ship with the application as npm packages (both under free licences: Merriweather Sans
 * under the SIL Open Font License 1.1, DejaVu Sans under the Bitstream Vera licence with the
 * DejaVu changes in the public domain). Merriweather Sans sets the text; its shipped subsets lack
 * σ, ε, ≤, ≥ and √, so each character it has no glyph for is set in DejaVu Sans instead, which
 * has them all: no symbol prints as an empty box.
 */
const require = createRequire(import.meta.url)
const folderOf = (pkg: string) => join(dirname(require.resolve(`${pkg}/LICENSE`)), 'files')

type Style = 'normal' | 'bold' | 'italics' | 'bolditalics'
const WEIGHTS: Record<Style, string> = {
  normal: '400-normal',
  bold: '700-normal',
  italics: '400-italic',
  bolditalics: '700-italic',
}

function family(pkg: string, prefix: string): Record<Style, string> {
  const folder = folderOf(pkg)
  const files = Object.entries(WEIGHTS).map(([style, weight]) => [
    style,
    join(folder, `${prefix}-${weight}.woff`),
  ])
  return Object.fromEntries(files) as Record<Style, string>
}

/** In the order a character looks for its glyph. */
export const FONT_FAMILIES = {
  Text: family('@fontsource/merriweather-sans', 'merriweather-sans-latin'),
  TextExt: family('@fontsource/merriweather-sans', 'merriweather-sans-latin-ext'),
  Symbols: family('@fontsource/dejavu-sans', 'dejavu-sans-latin'),
} as const
export type FontName = keyof typeof FONT_FAMILIES
const CHAIN = Object.keys(FONT_FAMILIES) as FontName[]
const LAST: FontName = 'Symbols'

export const FONT_FILES: ReadonlySet<string> = new Set(
  Object.values(FONT_FAMILIES).flatMap((styles) => Object.values(styles)),
)

let coverage: Map<FontName, fontkit.Font> | null = null
const chosen = new Map<number, FontName>()

function fontsForCoverage(): Map<FontName, fontkit.Font> {
  coverage ??= new Map(
    CHAIN.map((name) => [
      name,
      fontkit.create(readFileSync(FONT_FAMILIES[name].normal)) as fontkit.Font,
    ]),
  )
  return coverage
}

/** The first font of the chain with a glyph for this character (the last one when none has). */
export function fontFor(codePoint: number): FontName {
  let name = chosen.get(codePoint)
  if (name) return name
  const fonts = fontsForCoverage()
  name = CHAIN.find((candidate) => fonts.get(candidate)?.hasGlyphForCodePoint(codePoint)) ?? LAST
  chosen.set(codePoint, name)
  return name
}

/** The text cut into runs that one font each can set, in order. */
export function fontRuns(text: string): { text: string; font: FontName }[] {
  const runs: { text: string; font: FontName }[] = []
  for (const char of text) {
    const font = fontFor(char.codePointAt(0) as number)
    const last = runs[runs.length - 1]
    if (last && last.font === font) last.text += char
    else runs.push({ text: char, font })
  }
  return runs
}
