import sharp from 'sharp'
import { scaleBar } from '../../../shared/photos/scale'
import type { Mark, PhotoScale } from '../../../shared/schemas/photos'

const INK = '#ffd400'
const HALO = '#000000'

const escapeXml = (text: string) => text.replace(/[<>&"']/g, (c) => `&#${c.charCodeAt(0)};`)

/** An arrow as a shaft and a filled head, in figure pixels. */
function arrowSvg(x1: number, y1: number, x2: number, y2: number, stroke: number): string {
  const angle = Math.atan2(y2 - y1, x2 - x1)
  const head = stroke * 5
  const wing = (side: number) =>
    `${x2 - head * Math.cos(angle + side * 0.45)},${y2 - head * Math.sin(angle + side * 0.45)}`
  return (
    `<line x1="${x1}" y1="${y1}" x2="${x2}" y2="${y2}" />` +
    `<polygon points="${x2},${y2} ${wing(1)} ${wing(-1)}" fill="${INK}" />`
  )
}

function markSvg(mark: Mark, k: number, stroke: number, fontSize: number): string {
  switch (mark.kind) {
    case 'arrow':
      return arrowSvg(mark.from.x * k, mark.from.y * k, mark.to.x * k, mark.to.y * k, stroke)
    case 'circle':
      return `<circle cx="${mark.centre.x * k}" cy="${mark.centre.y * k}" r="${mark.radius * k}" fill="none" />`
    case 'outline':
      return `<polyline fill="none" points="${mark.points.map((p) => `${p.x * k},${p.y * k}`).join(' ')}" />`
    case 'label':
      return (
        `<text x="${mark.at.x * k}" y="${mark.at.y * k}" font-size="${fontSize}" fill="${INK}" ` +
        `stroke="${HALO}" stroke-width="${stroke / 2}" paint-order="stroke">${escapeXml(mark.text)}</text>`
      )
  }
}

function scaleBarSvg(
  scale: PhotoScale,
  k: number,
  width: number,
  height: number,
  fontSize: number,
) {
  const bar = scaleBar(scale.micrometresPerPixel / k, width)
  const margin = Math.round(width * 0.03)
  const barHeight = Math.max(4, Math.round(fontSize / 3))
  const x = width - margin - bar.pixels
  const y = height - margin - barHeight
  return (
    `<rect x="${x - 8}" y="${y - fontSize - 14}" width="${bar.pixels + 16}" height="${fontSize + barHeight + 22}" fill="${HALO}" fill-opacity="0.6" stroke="none" />` +
    `<rect data-scale-bar="${bar.micrometres}" x="${x}" y="${y}" width="${bar.pixels}" height="${barHeight}" fill="#ffffff" stroke="none" />` +
    `<text x="${x + bar.pixels / 2}" y="${y - 6}" font-size="${fontSize}" fill="#ffffff" stroke="none" text-anchor="middle">${escapeXml(bar.label)}</text>`
  )
}

/**
 * The overlay for a figure `width` × `height` pixels made from a photo whose original is
 * `originalWidth` wide: marks are kept in original pixels and scaled here.
 */
export function figureOverlay(
  input: { marks: Mark[]; scale: PhotoScale | null; originalWidth: number },
  width: number,
  height: number,
): string {
  const k = width / input.originalWidth
  const stroke = Math.max(2, Math.round(width / 400))
  const fontSize = Math.max(14, Math.round(width / 45))
  const marks = input.marks.map((mark) => markSvg(mark, k, stroke, fontSize)).join('')
  const bar = input.scale ? scaleBarSvg(input.scale, k, width, height, fontSize) : ''
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" ` +
    `font-family="DejaVu Sans, sans-serif" font-weight="bold">` +
    `<g stroke="${INK}" stroke-width="${stroke}" stroke-linecap="round">${marks}</g>${bar}</svg>`
  )
}

/** The display copy with its marks and scale bar burnt in, as a PNG for reports. */
export async function renderFigure(
  display: Buffer,
  input: { marks: Mark[]; scale: PhotoScale | null; originalWidth: number },
): Promise<Buffer> {
  const image = sharp(display)
  const { width, height } = (await image.metadata()) as { width: number; height: number }
  const overlay = Buffer.from(figureOverlay(input, width, height))
  return image
    .composite([{ input: overlay, top: 0, left: 0 }])
    .png()
    .toBuffer()
}
