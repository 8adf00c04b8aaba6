import { createRequire } from 'node:module'
import { pathToFileURL } from 'node:url'
import { Worker } from 'node:worker_threads'
import type { ReportPdfInput } from './input'
import type { PdfAnswer } from './worker'

// Compiled, the worker sits beside the server bundle as report-pdf-worker.js; from source (tsx,
// vitest) it is the TypeScript file, run through tsx's loader registered inside the worker.
const COMPILED = !import.meta.url.endsWith('.ts')

function startWorker(): Worker {
  if (COMPILED) return new Worker(new URL('./report-pdf-worker.js', import.meta.url))
  const workerFile = new URL('./worker.ts', import.meta.url).href
  const tsxApi = pathToFileURL(
    createRequire(import.meta.url)
      .resolve('tsx/esm/api')
      .replace(/\.cjs$/, '.mjs'),
  ).href
  const boot = `import(${JSON.stringify(tsxApi)}).then(({ register }) => { register(); return import(${JSON.stringify(workerFile)}) })`
  return new Worker(boot, { eval: true })
}

let running: Promise<unknown> = Promise.resolve()

/**
 * Lays out a report in a worker thread of its own, one report at a time, so a long report never
 * stalls the server's other requests; the worker ends with its report.
 */
export function renderReportPdfOffThread(input: ReportPdfInput): Promise<Buffer> {
  const job = running.then(
    () =>
      new Promise<Buffer>((resolve, reject) => {
        const worker = startWorker()
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
