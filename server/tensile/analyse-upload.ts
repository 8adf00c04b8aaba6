import { readFileSync } from 'node:fs'
import {
  analyseSpecimens,
  checkTensileOptions,
  TensileInputError,
  type SpecimenResult,
  type TensileOptions,
} from '../../shared/tensile'
import { AppError } from '../errors'

/** A record's bytes, or the file holding them (read where the analysis runs, never copied across). */
export type UploadSource = Uint8Array | { path: string }

/** What the server asks of the engine: one record's bytes and options → its result. */
export type TensileAnalyser = (
  name: string,
  source: UploadSource,
  options: TensileOptions,
) => Promise<SpecimenResult>

/** The engine's refusal as the API's 422, with the engine's own message. */
export function tensileRefusal(error: unknown): never {
  if (error instanceof TensileInputError) throw new AppError('tensile_input', error.message)
  throw error
}

/** Checks options against the engine's contract; a refusal is a 422 with the engine's words. */
export function checkedOptions(input: unknown): TensileOptions {
  try {
    return checkTensileOptions(input)
  } catch (error) {
    tensileRefusal(error)
  }
}

/**
 * The analysis itself, exactly as the command line runs it: UTF-8 text through the one
 * pipeline. Used in the worker threads and, where no pool is running, in the request's thread.
 */
export function analyseBytes(
  name: string,
  source: UploadSource,
  options: TensileOptions,
): SpecimenResult {
  const bytes = source instanceof Uint8Array ? source : readFileSync(source.path)
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8')
  const report = analyseSpecimens([{ name, source: text }], options)
  if (Array.isArray(report)) throw new Error('one record gave a set of results')
  return report
}

/** An analyser that runs in the calling thread (tests of small records, the command line). */
export const analyseInThread: TensileAnalyser = (name, source, options) => {
  try {
    return Promise.resolve(analyseBytes(name, source, options))
  } catch (error) {
    return Promise.reject(error instanceof TensileInputError ? error : (error as Error))
  }
}
