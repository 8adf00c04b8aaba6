import { crc32 } from 'node:zlib'
import sharp from 'sharp'

/** A picture with structure (a gradient and a bright corner), so orientation can be checked. */
function scene(width: number, height: number) {
  const pixels = Buffer.alloc(width * height * 3)
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const at = (y * width + x) * 3
      const corner = x < width / 4 && y < height / 4
      pixels[at] = corner ? 255 : Math.round((x / width) * 200)
      pixels[at + 1] = corner ? 255 : Math.round((y / height) * 200)
      pixels[at + 2] = corner ? 255 : 60
    }
  }
  return sharp(pixels, { raw: { width, height, channels: 3 } })
}

/**
 * A JPEG stored sideways (wider than tall, EXIF Orientation 6: rotate 90° clockwise to view) with
 * a GPS position in its EXIF block, as phones write them.
 */
export function sidewaysJpegWithGps(width = 120, height = 80): Promise<Buffer> {
  return scene(width, height)
    .jpeg({ quality: 90 })
    .withMetadata({ orientation: 6 })
    .withExifMerge({
      IFD0: { Make: 'Fractolog test' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1' },
    })
    .toBuffer()
}

export const plainJpeg = (width = 64, height = 48) => scene(width, height).jpeg().toBuffer()
export const plainPng = (width = 64, height = 48) => scene(width, height).png().toBuffer()
export const plainWebp = (width = 64, height = 48) => scene(width, height).webp().toBuffer()

/**
 * A 16-bit-per-channel RGB TIFF, as microscope cameras write them, built by hand after the TIFF 6.0
 * specification (baseline RGB, section 6; little-endian header, one uncompressed strip) so it
 * does not depend on the image library under test.
 */
export function sixteenBitTiff(width = 64, height = 48): Buffer {
  const tags: [number, number, number, number][] = [] // tag, type (3 SHORT, 4 LONG), count, value
  const pixelBytes = width * height * 3 * 2
  const entries = 10
  const ifdAt = 8
  const bitsAt = ifdAt + 2 + entries * 12 + 4
  const dataAt = bitsAt + 6
  tags.push([256, 4, 1, width], [257, 4, 1, height], [258, 3, 3, bitsAt], [259, 3, 1, 1])
  tags.push([262, 3, 1, 2], [273, 4, 1, dataAt], [277, 3, 1, 3], [278, 4, 1, height])
  tags.push([279, 4, 1, pixelBytes], [284, 3, 1, 1])
  const file = Buffer.alloc(dataAt + pixelBytes)
  file.write('II', 0, 'latin1')
  file.writeUInt16LE(42, 2)
  file.writeUInt32LE(ifdAt, 4)
  file.writeUInt16LE(entries, ifdAt)
  tags.forEach(([tag, type, count, value], i) => {
    const at = ifdAt + 2 + i * 12
    file.writeUInt16LE(tag, at)
    file.writeUInt16LE(type, at + 2)
    file.writeUInt32LE(count, at + 4)
    if (type === 3 && count === 1) file.writeUInt16LE(value, at + 8)
    else file.writeUInt32LE(value, at + 8)
  })
  for (let i = 0; i < 3; i++) file.writeUInt16LE(16, bitsAt + i * 2)
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const at = dataAt + (y * width + x) * 6
      file.writeUInt16LE(Math.round((x / width) * 65535), at)
      file.writeUInt16LE(Math.round((y / height) * 65535), at + 2)
      file.writeUInt16LE(20000, at + 4)
    }
  }
  return file
}

/** A JPEG cut off in the middle of its compressed data, as an interrupted copy leaves it. */
export async function truncatedJpeg(): Promise<Buffer> {
  const whole = await plainJpeg(400, 300)
  return whole.subarray(0, Math.floor(whole.length * 0.6))
}

/**
 * A small PNG whose header claims `width` × `height` pixels (a decompression bomb's trick): the
 * IHDR chunk is rewritten with its CRC-32 recomputed (PNG specification, 11.2.2), the data left
 * as it was.
 */
export async function pngClaiming(width: number, height: number): Promise<Buffer> {
  const png = Buffer.from(await plainPng(8, 8))
  // signature (8) + length (4) + "IHDR" (4) → width at 16, height at 20, CRC after 13 data bytes
  png.writeUInt32BE(width, 16)
  png.writeUInt32BE(height, 20)
  png.writeUInt32BE(crc32(png.subarray(12, 29)), 29)
  return png
}
