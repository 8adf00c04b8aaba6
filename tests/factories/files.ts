import sharp from 'sharp'

/** A minimal but well-formed one-page PDF (PDF 1.4 structure: header, catalog, pages, trailer). */
export function tinyPdf(): Buffer {
  const objects = [
    '1 0 obj << /Type /Catalog /Pages 2 0 R >> endobj',
    '2 0 obj << /Type /Pages /Kids [3 0 R] /Count 1 >> endobj',
    '3 0 obj << /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >> endobj',
  ]
  let body = '%PDF-1.4\n'
  const offsets: number[] = []
  for (const object of objects) {
    offsets.push(body.length)
    body += `${object}\n`
  }
  const xref = body.length
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`
  body += offsets.map((offset) => `${String(offset).padStart(10, '0')} 00000 n \n`).join('')
  body += `trailer << /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`
  return Buffer.from(body, 'latin1')
}

/** A small PNG drawn with sharp. */
export function tinyPng(): Promise<Buffer> {
  return sharp({
    create: { width: 8, height: 8, channels: 3, background: { r: 40, g: 90, b: 110 } },
  })
    .png()
    .toBuffer()
}
