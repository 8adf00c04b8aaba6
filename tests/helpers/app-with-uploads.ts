import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { createApp, type AppDeps } from '../../server/app'
import type { Db } from '../../server/db/knex'
import type { FileStorage } from '../../server/storage/file-storage'
import { createLocalStorage } from '../../server/storage/local-storage'
import { testConfig } from './test-config'

/** Local file storage in a temporary folder of its own; `cleanup()` removes the folder. */
export function temporaryStorage() {
  const uploads = mkdtempSync(join(tmpdir(), 'fractolog-test-uploads-'))
  const storage = createLocalStorage(uploads)
  const cleanup = () => rmSync(uploads, { recursive: true, force: true })
  return { uploads, storage, cleanup }
}

interface AppWithUploadsOptions extends Partial<Omit<AppDeps, 'db' | 'storage'>> {
  /** wraps the folder's storage, e.g. to make a write fail as a full disk would */
  storage?: (local: FileStorage) => FileStorage
}

/**
 * The API with stored files in a temporary folder of its own (uploads wait in its `incoming/`),
 * so a test can look at what was stored and nothing is left behind: `cleanup()` removes it.
 */
export function appWithUploads(db: Db, options: AppWithUploadsOptions = {}) {
  const { uploads, storage: local, cleanup } = temporaryStorage()
  const incomingDir = join(uploads, 'incoming')
  const storage = options.storage ? options.storage(local) : local
  const app = createApp({
    config: testConfig(),
    clientDir: '/nonexistent',
    incomingDir,
    ...options,
    db,
    storage,
  })
  return { app, uploads, incomingDir, storage, cleanup }
}
