import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs'

/**
 * The text of each page of a PDF as a reader's copy and paste would give it (pdfjs-dist, the
 * legacy build that runs on Node 20): items joined in drawing order, a line break where pdf.js
 * sees one.
 */
export async function pdfPageTexts(pdf: Buffer): Promise<string[]> {
  const document = await getDocument({
    data: new Uint8Array(pdf),
    useSystemFonts: false,
    isEvalSupported: false,
    disableFontFace: true,
  }).promise
  const pages: string[] = []
  for (let number = 1; number <= document.numPages; number++) {
    const page = await document.getPage(number)
    const content = await page.getTextContent({ disableNormalization: true })
    pages.push(
      content.items
        .map((item) => ('str' in item ? item.str + (item.hasEOL ? '\n' : '') : ''))
        .join(''),
    )
  }
  await document.destroy()
  return pages
}

/** Spaces and line breaks folded to one space, for checks of sentences that may wrap. */
export const flat = (text: string) => text.replace(/\s+/g, ' ')
