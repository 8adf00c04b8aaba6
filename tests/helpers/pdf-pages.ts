import { execFile } from 'node:child_process'
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { promisify } from 'node:util'

const run = promisify(execFile)

/** Where the PDF tests leave their files and page images, to be looked at (git-ignored). */
export const PDF_ARTIFACTS_DIR = '.data/test-artifacts/pdf'

/**
 * Writes the PDF beside its first pages as PNG images, drawn by Debian's pdftoppm (poppler-utils,
 * installed by `npm test` when missing); answers the image paths in page order.
 */
export async function pdfPagesAsPng(pdf: Buffer, name: string, lastPage = 3): Promise<string[]> {
  mkdirSync(PDF_ARTIFACTS_DIR, { recursive: true })
  const file = join(PDF_ARTIFACTS_DIR, `${name}.pdf`)
  writeFileSync(file, pdf)
  const prefix = join(PDF_ARTIFACTS_DIR, name)
  await run('pdftoppm', ['-png', '-r', '72', '-f', '1', '-l', String(lastPage), file, prefix])
  return readdirSync(PDF_ARTIFACTS_DIR)
    .filter((entry) => entry.startsWith(`${name}-`) && entry.endsWith('.png'))
    .sort()
    .map((entry) => join(PDF_ARTIFACTS_DIR, entry))
}
