import { createRequire } from 'node:module'
import type { TDocumentDefinitions, TFontDictionary } from 'pdfmake/interfaces'
import type PDFKit from 'pdfkit'

/*
 * pdfmake's printer used directly rather than through its shared module instance: each report
 * gets its own in-memory files (fonts and figures), nothing is fetched and no file is read.
 */
interface MemoryFiles {
  existsSync(name: string): boolean
  readFileSync(name: string): Buffer
  writeFileSync(name: string, content: Buffer): void
}
interface Resolver {
  setUrlAccessPolicy(policy: (url: string) => boolean): void
}
interface Printer {
  createPdfKitDocument(definition: TDocumentDefinitions): Promise<PDFKit.PDFDocument>
}

const require = createRequire(import.meta.url)
const PdfPrinter = (
  require('pdfmake/js/Printer') as { default: new (...args: unknown[]) => Printer }
).default
const URLResolver = (
  require('pdfmake/js/URLResolver') as { default: new (fs: MemoryFiles) => Resolver }
).default

function memoryFiles(files: ReadonlyMap<string, Buffer>): MemoryFiles {
  return {
    existsSync: (name) => files.has(name),
    readFileSync: (name) => {
      const bytes = files.get(name)
      if (!bytes) throw new Error(`No file ${name} for the report`)
      return bytes
    },
    writeFileSync: () => {
      throw new Error('A report fetches nothing')
    },
  }
}

/** Lays out and draws the document; its fonts and images are the named bytes in `files`. */
export async function printPdf(
  definition: TDocumentDefinitions,
  fonts: TFontDictionary,
  files: ReadonlyMap<string, Buffer>,
): Promise<Buffer> {
  const fs = memoryFiles(files)
  const resolver = new URLResolver(fs)
  resolver.setUrlAccessPolicy(() => false)
  // the printer writes resolved names back into the font table: give it a copy of its own
  const printer = new PdfPrinter(structuredClone(fonts), fs, resolver, () => false)
  const document = await printer.createPdfKitDocument(definition)
  const chunks: Buffer[] = []
  document.on('data', (chunk: Buffer) => chunks.push(chunk))
  const ended = new Promise<void>((resolve, reject) => {
    document.on('end', resolve)
    document.on('error', reject)
  })
  document.end()
  await ended
  return Buffer.concat(chunks)
}
