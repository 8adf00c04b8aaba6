import { parentPort } from 'node:worker_threads'
import type { ReportPdfInput } from './input'
import { renderReportPdf } from './render'

export type PdfAnswer = { pdf: Uint8Array } | { error: string }

/** Buffers arrive as plain Uint8Arrays after the structured clone: make them Buffers again. */
function revive(input: ReportPdfInput): ReportPdfInput {
  const figures = Object.fromEntries(
    Object.entries(input.figures).map(([id, figure]) => {
      const bytes = figure.png as Uint8Array
      return [id, { png: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength) }]
    }),
  )
  return { ...input, figures }
}

parentPort?.once('message', async (input: ReportPdfInput) => {
  try {
    const pdf = await renderReportPdf(revive(input))
    parentPort?.postMessage({ pdf } satisfies PdfAnswer, [pdf.buffer as ArrayBuffer])
  } catch (error) {
    parentPort?.postMessage({ error: error instanceof Error ? error.message : String(error) })
  }
})
