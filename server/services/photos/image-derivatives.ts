import sharp from 'sharp'
import { MAX_PHOTO_PIXELS } from '../../../shared/schemas/photos'
import { AppError } from '../../errors'

/** Longest side of the display copy and of the thumbnail, in pixels (common practice for web views). */
export const DISPLAY_SIZE = 2048
export const THUMBNAIL_SIZE = 320

// libvips threads per image; a few images at a time so parallel uploads cannot pile up decoded
// pixels (a 24-megapixel image decodes to about 72 MB).
sharp.concurrency(2)
const MAX_PARALLEL_IMAGES = 2

let running = 0
const waiting: (() => void)[] = []

/** Runs `work` when fewer than MAX_PARALLEL_IMAGES images are being decoded. */
export async function withImageSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= MAX_PARALLEL_IMAGES) await new Promise<void>((go) => waiting.push(go))
  running += 1
  try {
    return await work()
  } finally {
    running -= 1
    waiting.shift()?.()
  }
}

export interface Derivatives {
  /** upright size of the original */
  width: number
  height: number
  display: { bytes: Buffer; width: number; height: number }
  thumbnail: Buffer
}

const open = (input: string | Buffer, maxPixels: number) =>
  sharp(input, { limitInputPixels: maxPixels, failOn: 'warning', sequentialRead: true })

function refusal(error: unknown, fileName: string): AppError {
  const text = error instanceof Error ? error.message : ''
  if (/pixel limit/i.test(text)) {
    return new AppError(
      'image_too_large',
      `“${fileName}” has more pixels than allowed (${MAX_PHOTO_PIXELS / 1e6} megapixels).`,
      { fileName },
    )
  }
  return new AppError(
    'image_unreadable',
    `“${fileName}” is damaged or incomplete and cannot be read.`,
    {
      fileName,
    },
  )
}

/**
 * Reads the image whole (so a truncated or corrupt file is refused here) and derives the display
 * copy and thumbnail: turned upright by its orientation tag, sRGB, 8-bit, every metadata block
 * (EXIF with GPS, XMP, IPTC, ICC) left out, since sharp writes none unless asked.
 */
export async function deriveCopies(
  path: string,
  fileName: string,
  maxPixels = MAX_PHOTO_PIXELS,
): Promise<Derivatives> {
  return withImageSlot(async () => {
    try {
      const meta = await open(path, maxPixels).metadata()
      const display = await open(path, maxPixels)
        .rotate()
        .resize(DISPLAY_SIZE, DISPLAY_SIZE, { fit: 'inside', withoutEnlargement: true })
        .flatten({ background: '#ffffff' })
        .toColourspace('srgb')
        .jpeg({ quality: 88 })
        .toBuffer({ resolveWithObject: true })
      const thumbnail = await sharp(display.data)
        .resize(THUMBNAIL_SIZE, THUMBNAIL_SIZE, { fit: 'inside', withoutEnlargement: true })
        .jpeg({ quality: 80 })
        .toBuffer()
      const turned = (meta.orientation ?? 1) >= 5
      const width = (turned ? meta.height : meta.width) as number
      const height = (turned ? meta.width : meta.height) as number
      const { data, info } = display
      return {
        width,
        height,
        display: { bytes: data, width: info.width, height: info.height },
        thumbnail,
      }
    } catch (error) {
      throw refusal(error, fileName)
    }
  })
}
