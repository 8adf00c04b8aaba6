import { closeSync, openSync, readSync, statSync } from 'node:fs'
import { StringDecoder } from 'node:string_decoder'
import { TensileInputError, type RecordChunks } from '../../shared/tensile'

/* Chunks below a megabyte stay ordinary heap strings, which V8 searches fastest (measured). */
const CHUNK_BYTES = 64 * 1024

function readable<T>(work: () => T): T {
  try {
    return work()
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code ?? 'unreadable'
    throw new TensileInputError(`Cannot read the file (${code})`)
  }
}

/**
 * A file as the engine's record source: UTF-8 text in chunks of 64 kB, read when
 * the engine asks for them, so a long record is never held whole in memory.
 */
export function fileChunks(file: string): RecordChunks {
  return {
    // Bytes are an upper bound of the characters of UTF-8 text.
    get characters() {
      return readable(() => statSync(file).size)
    },
    *[Symbol.iterator]() {
      const descriptor = readable(() => openSync(file, 'r'))
      const decoder = new StringDecoder('utf8')
      const buffer = Buffer.alloc(CHUNK_BYTES)
      try {
        for (;;) {
          const read = readable(() => readSync(descriptor, buffer, 0, CHUNK_BYTES, null))
          if (read === 0) break
          yield decoder.write(buffer.subarray(0, read))
        }
        yield decoder.end()
      } finally {
        closeSync(descriptor)
      }
    },
  }
}
