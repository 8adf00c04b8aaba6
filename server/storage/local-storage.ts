import { createHash, randomUUID } from 'node:crypto'
import { createReadStream } from 'node:fs'
import { copyFile, mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises'
import { dirname, join, resolve } from 'node:path'
import { pipeline } from 'node:stream/promises'
import { AppError } from '../errors'
import type { FileStorage, StoredFile } from './file-storage'

const KEY_PATTERN = /^[0-9a-f]{2}\/[0-9a-f-]{36}$/
const FOLDER_PATTERN = /^[0-9a-f]{2}$/

const sha256Of = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex')

async function sha256OfFile(path: string): Promise<string> {
  const hash = createHash('sha256')
  await pipeline(createReadStream(path), hash)
  return hash.digest('hex')
}

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

  async function newKey() {
    const id = randomUUID()
    const key = `${id.slice(0, 2)}/${id}`
    await mkdir(dirname(pathOf(key)), { recursive: true })
    return { key, path: pathOf(key), partial: `${pathOf(key)}.partial` }
  }

  async function put(bytes: Uint8Array): Promise<StoredFile> {
    const { key, path, partial } = await newKey()
    await writeFile(partial, bytes, { flag: 'wx' })
    await rename(partial, path)
    return { key, sha256: sha256Of(bytes), size: bytes.byteLength }
  }

  async function putFile(source: string): Promise<StoredFile> {
    const { key, path, partial } = await newKey()
    await copyFile(source, partial)
    try {
      // the hash is taken from the stored copy, so it vouches for what will be served
      const [sha256, info] = await Promise.all([sha256OfFile(partial), stat(partial)])
      await rename(partial, path)
      return { key, sha256, size: info.size }
    } catch (error) {
      await rm(partial, { force: true })
      throw error
    }
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

  async function sweep(isKnown: (keys: string[]) => Promise<Set<string>>): Promise<number> {
    let removed = 0
    const folders = await readdir(root).catch(() => [] as string[])
    for (const folder of folders.filter((name) => FOLDER_PATTERN.test(name))) {
      const names = await readdir(join(root, folder))
      const keys = names.filter((name) => !name.endsWith('.partial')).map((n) => `${folder}/${n}`)
      const known = await isKnown(keys.filter((key) => KEY_PATTERN.test(key)))
      const strays = [
        ...names.filter((name) => name.endsWith('.partial')).map((n) => join(root, folder, n)),
        ...keys.filter((key) => KEY_PATTERN.test(key) && !known.has(key)).map(pathOf),
      ]
      await Promise.all(strays.map((path) => rm(path, { force: true })))
      removed += strays.length
    }
    return removed
  }

  return { put, putFile, read, remove, sweep }
}
