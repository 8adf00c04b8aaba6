import type { Worker } from 'node:worker_threads'
import { TensileInputError, type SpecimenResult } from '../../shared/tensile'
import type { TensileAnalyser } from './analyse-upload'
import type { AnalysisAnswer, AnalysisJob } from './analysis-worker'
import { startWorker } from '../start-worker'

interface Pending {
  job: AnalysisJob
  resolve: (result: SpecimenResult) => void
  reject: (error: Error) => void
}

interface Slot {
  worker: Worker
  busy: Pending | null
}

const ANALYSIS_WORKER = { source: './analysis-worker.ts', compiled: 'analysis-worker.js' }

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
    const slot: Slot = { worker: startWorker(import.meta.url, ANALYSIS_WORKER), busy: null }
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
