import { readdir, rm } from 'node:fs/promises'
import { join } from 'node:path'
import type { Knex } from 'knex'
import { incomingDirOf } from '../middleware/upload'
import { knownStorageKeys } from '../services/photos/photos'
import { createLocalStorage } from './local-storage'

/**
 * At start, before any request: removes uploads a crash interrupted (temporary files, half-written
 * files, stored files no record names), so no file outlives a refused or broken upload.
 */
export async function sweepUploads(db: Knex, uploadsDir: string): Promise<number> {
  const incoming = incomingDirOf(uploadsDir)
  const waiting = await readdir(incoming).catch(() => [] as string[])
  await Promise.all(waiting.map((name) => rm(join(incoming, name), { force: true })))
  const stored = await createLocalStorage(uploadsDir).sweep((keys) => knownStorageKeys(db, keys))
  return waiting.length + stored
}
