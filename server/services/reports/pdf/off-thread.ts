import { startWorker } from '../../../start-worker'
import type { ReportPdfInput } from './input'
import type { PdfAnswer } from './worker'

const PDF_WORKER = { source: './worker.ts', compiled: 'report-pdf-worker.js' }

let running: Promise<unknown> = Promise.resolve()

/**
 * Lays out a report in a worker thread of its own, one report at a time, so a long report never
 * stalls the server's other requests; the worker ends with its report.
 */
export function renderReportPdfOffThread(input: ReportPdfInput): Promise<Buffer> {
  const job = running.then(
    () =>
      new Promise<Buffer>((resolve, reject) => {
        const worker = startWorker(import.meta.url, PDF_WORKER)
        worker.once('message', (answer: PdfAnswer) => {
          void worker.terminate()
          if ('pdf' in answer)
            resolve(Buffer.from(answer.pdf.buffer, answer.pdf.byteOffset, answer.pdf.byteLength))
          else reject(new Error(`The report's PDF could not be made: ${answer.error}`))
        })
        worker.once('error', reject)
        worker.once('exit', (code) => reject(new Error(`The PDF worker ended (${code}).`)))
        worker.postMessage(input)
      }),
  )
  running = job.catch(() => undefined)
  return job
}
