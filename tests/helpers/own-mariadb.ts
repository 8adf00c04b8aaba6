import { mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { createServer } from 'node:net'
import { join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import {
  ensureDatabase,
  startLocalMariadb,
  stopLocalMariadb,
  type LocalMariadbOptions,
} from '../../server/db/local-mariadb'

const instancesDir = resolve(fileURLToPath(import.meta.url), '../../../.data/instances')

/** A TCP port nobody listens on right now. */
export function freePort(): Promise<number> {
  return new Promise((found, fail) => {
    const probe = createServer()
    probe.once('error', fail)
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address()
      probe.close(() => (typeof address === 'object' && address ? found(address.port) : fail()))
    })
  })
}

export interface OwnMariadb {
  options: LocalMariadbOptions
  /** the URL of a database (created on first call) owned by a loopback account */
  databaseUrl: (database: string) => Promise<string>
  start: () => Promise<void>
  stop: () => Promise<void>
  /** stops the server and deletes its data folder */
  remove: () => Promise<void>
}

/**
 * A MariaDB instance of the test's own, with its own data folder and port, started and stopped
 * through the same code as the private MariaDB of `npm start`: never the instance the other API
 * tests share.
 */
export async function ownMariadb(label: string): Promise<OwnMariadb> {
  mkdirSync(instancesDir, { recursive: true })
  const options = { dataDir: mkdtempSync(join(instancesDir, `${label}-`)), port: await freePort() }
  const start = async () => {
    await startLocalMariadb(options)
  }
  const stop = () => stopLocalMariadb(options)
  await start()
  return {
    options,
    databaseUrl: (database) =>
      ensureDatabase(options, { database, user: 'fractolog', password: 'own-instance-only' }),
    start,
    stop,
    remove: async () => {
      await stop()
      rmSync(options.dataDir, { recursive: true, force: true })
    },
  }
}
