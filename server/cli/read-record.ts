import { closeSync, openSync, readSync } from 'node:fs'
import { TensileInputError } from '../../shared/tensile'

const CHUNK_BYTES = 1024 * 1024

function readable<T>(work: () => T): T {
  try {
    return work()
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'unreadable'
    throw new TensileInputError(`Cannot read the file (${code})`)
  }
}

/**
 * A file as the engine's record source: UTF-8 text in chunks of about a megabyte, read when
 * the engine asks for them, so a long record is never held whole in memory.
 */
export function fileChunks(file: string): Iterable<string> {
  return {
    *[Symbol.iterator]() {
      const descriptor = readable(() => openSync(file, 'r'))
      const decoder = new TextDecoder('utf-8')
      const buffer = new Uint8Array(CHUNK_BYTES)
      try {
        for (;;) {
          const read = readable(() => readSync(descriptor, buffer, 0, CHUNK_BYTES, null))
          if (read === 0) break
          yield decoder.decode(buffer.subarray(0, read), { stream: true })
        }
        yield decoder.decode()
      } finally {
        closeSync(descriptor)
      }
    },
  }
}
