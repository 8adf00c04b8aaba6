import { isDatabaseUnavailable } from '../db/availability'

export interface ProcessGuardOptions {
  /** called once for an error after which the process must not go on serving */
  onFatal: (error: unknown) => void
  log?: (message: string, error: unknown) => void
}

/**
 * The last line of defence against an error nobody caught. One that only says the database is
 * out of reach (a connection the pool had already given up on, a query whose request was
 * answered 503) leaves nothing half-done in this process: it is logged and the server keeps
 * serving, and recovers when MariaDB is back. Anything else means the program is in a state
 * nobody planned for: it is logged and `onFatal` shuts the process down in order.
 */
export function guardProcess(options: ProcessGuardOptions): void {
  const log = options.log ?? ((message, error) => console.error(message, error))
  let fatal = false
  const handle = (kind: string) => (error: unknown) => {
    if (isDatabaseUnavailable(error)) {
      log(`${kind} while the database is unavailable (still serving):`, error)
      return
    }
    log(`${kind}; shutting down:`, error)
    if (fatal) return
    fatal = true
    options.onFatal(error)
  }
  process.on('unhandledRejection', handle('Unhandled rejection'))
  process.on('uncaughtException', handle('Uncaught exception'))
}
