import { createRequire } from 'node:module'
import { pathToFileURL } from 'node:url'
import { Worker } from 'node:worker_threads'
import { TensileInputError, type SpecimenResult } from '../../shared/tensile'
import type { TensileAnalyser } from './analyse-upload'
import type { AnalysisAnswer, AnalysisJob } from './analysis-worker'

interface Pending {
  job: AnalysisJob
  resolve: (result: SpecimenResult) => void
  reject: (error: Error) => void
}

interface Slot {
  worker: Worker
  busy: Pending | null
}

// Compiled, the worker sits beside the server bundle as analysis-worker.js; from source (tsx,
// vitest) it is the TypeScript file, run through tsx's loader registered inside the worker
// (Node 20 does not pass an --import loader on to worker threads).
const COMPILED = !import.meta.url.endsWith('.ts')

function startWorker(): Worker {
  if (COMPILED) return new Worker(new URL('./analysis-worker.js', import.meta.url))
  const workerFile = new URL('./analysis-worker.ts', import.meta.url).href
  // require.resolve finds the CommonJS build of tsx's ESM API; the worker imports its ESM twin.
  const tsxApi = pathToFileURL(
    createRequire(import.meta.url)
      .resolve('tsx/esm/api')
      .replace(/\.cjs$/, '.mjs'),
  ).href
  const boot = `import(${JSON.stringify(tsxApi)}).then(({ register }) => { register(); return import(${JSON.stringify(workerFile)}) })`
  return new Worker(boot, { eval: true })
}

/**
 * Tensile analyses off the request thread: a fixed number of worker threads, started on first
 * use, each taking one record at a time from a queue, so a million-point record never stalls the
 * server's other requests. A worker that dies is replaced and its job refused with an error.
 */
export function createAnalysisPool(size: number) {
  const slots: Slot[] = []
  const queue: Pending[] = []
  let nextId = 1

  function settle(slot: Slot, answer: AnalysisAnswer): void {
    const pending = slot.busy
    slot.busy = null
    if (pending && 'result' in answer) pending.resolve(answer.result as SpecimenResult)
    else if (pending && 'error' in answer)
      pending.reject(
        answer.error.input
          ? new TensileInputError(answer.error.message)
          : new Error(answer.error.message),
      )
    dispatch()
  }

  function addSlot(): Slot {
    const slot: Slot = { worker: startWorker(), busy: null }
    slot.worker.on('message', (answer: AnalysisAnswer) => settle(slot, answer))
    slot.worker.on('error', (error) => {
      slot.busy?.reject(error)
      slot.busy = null
      slots.splice(slots.indexOf(slot), 1)
      dispatch()
    })
    slot.worker.unref()
    slots.push(slot)
    return slot
  }

  function dispatch(): void {
    while (queue.length > 0) {
      const slot = slots.find((s) => s.busy === null) ?? (slots.length < size ? addSlot() : null)
      if (!slot) return
      const pending = queue.shift()!
      slot.busy = pending
      const { source } = pending.job
      const transfer = source instanceof Uint8Array ? [source.buffer as ArrayBuffer] : []
      slot.worker.postMessage(pending.job, transfer)
    }
  }

  const analyse: TensileAnalyser = (name, given, options) =>
    new Promise((resolve, reject) => {
      // Bytes get a copy of their own, so the transfer never takes a buffer the caller still
      // holds; a file is read by the worker itself, so nothing large is copied on this thread.
      const source = given instanceof Uint8Array ? new Uint8Array(given) : { path: given.path }
      const job = { id: nextId++, name, source, options }
      queue.push({ job, resolve, reject })
      dispatch()
    })

  async function close(): Promise<void> {
    await Promise.all(slots.splice(0).map((slot) => slot.worker.terminate()))
  }

  return { analyse, close }
}

export type AnalysisPool = ReturnType<typeof createAnalysisPool>
