import sharp from 'sharp'
import { figureImageKey } from './figure-block'
import type { ReportPdfInput } from './input'

/** Below this a PNG (a drawing, a small figure) goes into the PDF as it is, losslessly. */
const EMBED_PNG_UP_TO_BYTES = 256 * 1024

/**
 * The figures' bytes for the layout, by their image keys. pdfkit reads a PNG byte by byte in
 * JavaScript (about 3 s for a 5 MB photograph) but a JPEG only by its markers; so a photograph's
 * PNG goes into the PDF as a JPEG of high quality without chroma subsampling, which keeps the
 * drawn marks and the scale bar sharp. sharp converts in its own threads, not the event loop.
 */
export async function figureImages(input: ReportPdfInput): Promise<Map<string, Buffer>> {
  const entries = await Promise.all(
    Object.entries(input.figures).map(async ([figureId, { png }]): Promise<[string, Buffer]> => {
      if (png.length <= EMBED_PNG_UP_TO_BYTES) return [figureImageKey(figureId), png]
      const jpeg = await sharp(png)
        .flatten({ background: '#ffffff' })
        .jpeg({ quality: 92, chromaSubsampling: '4:4:4' })
        .toBuffer()
      return [figureImageKey(figureId), jpeg]
    }),
  )
  return new Map(entries)
}
