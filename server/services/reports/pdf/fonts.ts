import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import * as fontkit from 'fontkit'
import { sfntFromWoff } from './woff'

/*
 * Fonts ship with the application as npm packages (both under free licences: Merriweather Sans
 * under the SIL Open Font License 1.1, DejaVu Sans under the Bitstream Vera licence with the
 * DejaVu changes in the public domain). Merriweather Sans sets the text; its shipped subsets lack
 * σ, ε, ≤, ≥ and √, so each character it has no glyph for is set in DejaVu Sans instead, which
 * has them all: no symbol prints as an empty box.
 */
const require = createRequire(import.meta.url)
const folderOf = (pkg: string) => join(dirname(require.resolve(`${pkg}/LICENSE`)), 'files')

const STYLES = ['normal', 'bold', 'italics', 'bolditalics'] as const
type Style = (typeof STYLES)[number]
const WEIGHTS: Record<Style, string> = {
  normal: '400-normal',
  bold: '700-normal',
  italics: '400-italic',
  bolditalics: '700-italic',
}

const SOURCES = {
  Text: ['@fontsource/merriweather-sans', 'merriweather-sans-latin'],
  TextExt: ['@fontsource/merriweather-sans', 'merriweather-sans-latin-ext'],
  Symbols: ['@fontsource/dejavu-sans', 'dejavu-sans-latin'],
} as const
export type FontName = keyof typeof SOURCES
/** In the order a character looks for its glyph. */
const CHAIN = Object.keys(SOURCES) as FontName[]
const LAST: FontName = 'Symbols'

const fileName = (name: FontName, style: Style) => `${name}-${style}.ttf`

/** pdfmake's font table: each family's styles by the names the font files go under in memory. */
export const FONT_FAMILIES = Object.fromEntries(
  CHAIN.map((name) => [
    name,
    Object.fromEntries(STYLES.map((style) => [style, fileName(name, style)])),
  ]),
) as Record<FontName, Record<Style, string>>

let unpacked: Map<string, Buffer> | null = null

/** The font files, unpacked from the packages' WOFF once per process. */
export function loadFontFiles(): Map<string, Buffer> {
  if (unpacked) return unpacked
  const files = new Map<string, Buffer>()
  for (const name of CHAIN) {
    const [pkg, prefix] = SOURCES[name]
    for (const style of STYLES) {
      const woff = readFileSync(join(folderOf(pkg), `${prefix}-${WEIGHTS[style]}.woff`))
      files.set(fileName(name, style), sfntFromWoff(woff))
    }
  }
  unpacked = files
  return files
}

let coverage: Map<FontName, fontkit.Font> | null = null
const chosen = new Map<number, FontName>()

function fontsForCoverage(): Map<FontName, fontkit.Font> {
  const files = loadFontFiles()
  coverage ??= new Map(
    CHAIN.map((name) => [
      name,
      fontkit.create(files.get(fileName(name, 'normal')) as Buffer) as fontkit.Font,
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
