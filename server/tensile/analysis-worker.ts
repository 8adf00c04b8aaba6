import { parentPort } from 'node:worker_threads'
import { TensileInputError, type TensileOptions } from '../../shared/tensile'
import { analyseBytes, type UploadSource } from './analyse-upload'

/**
 * One analysis job, as the pool posts it: the file's path (read here, off the request thread),
 * or the bytes as a transferred buffer.
 */
export interface AnalysisJob {
  id: number
  name: string
  source: UploadSource
  options: TensileOptions
}

export type AnalysisAnswer =
  { id: number; result: unknown } | { id: number; error: { input: boolean; message: string } }

parentPort?.on('message', (job: AnalysisJob) => {
  try {
    const result = analyseBytes(job.name, job.source, job.options)
    parentPort?.postMessage({ id: job.id, result } satisfies AnalysisAnswer)
  } catch (error) {
    const input = error instanceof TensileInputError
    const message = error instanceof Error ? error.message : String(error)
    parentPort?.postMessage({ id: job.id, error: { input, message } } satisfies AnalysisAnswer)
  }
})
