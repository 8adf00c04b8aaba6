import { createHash, randomUUID } from 'node:crypto'
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises'
import { dirname, join, resolve } from 'node:path'
import { AppError } from '../errors'
import type { FileStorage, StoredFile } from './file-storage'

const KEY_PATTERN = /^[0-9a-f]{2}\/[0-9a-f-]{36}$/

const sha256Of = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')

/**
 * Files in a local folder, named by the server (`ab/<uuid>`), written to a temporary name and
 * renamed so a crash never leaves half a file under a real key.
 */
export function createLocalStorage(rootDir: string): FileStorage {
  const root = resolve(rootDir)
  const pathOf = (key: string) => {
    if (!KEY_PATTERN.test(key)) throw new Error(`not a storage key: ${key}`)
    return join(root, key)
  }

  async function put(bytes: Uint8Array): Promise<StoredFile> {
    const id = randomUUID()
    const key = `${id.slice(0, 2)}/${id}`
    const path = pathOf(key)
    await mkdir(dirname(path), { recursive: true })
    const partial = `${path}.partial`
    await writeFile(partial, bytes, { flag: 'wx' })
    await rename(partial, path)
    return { key, sha256: sha256Of(bytes), size: bytes.byteLength }
  }

  async function read(file: Pick<StoredFile, 'key' | 'sha256'>): Promise<Buffer> {
    const bytes = await readFile(pathOf(file.key))
    if (sha256Of(bytes) !== file.sha256) {
      throw new AppError(
        'integrity_error',
        'A stored file does not match its recorded fingerprint; it was not served.',
        { key: file.key },
      )
    }
    return bytes
  }

  async function remove(key: string): Promise<void> {
    await rm(pathOf(key), { force: true })
  }

  return { put, read, remove }
}
