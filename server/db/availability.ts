// Errors that mean "the database cannot be reached right now" rather than "this query is wrong":
// refused or lost connections, a server shutting down, no free connection in time.
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_CON_COUNT_ERROR',
])

interface DriverError {
  name?: unknown
  code?: unknown
  /** mysql2 marks errors that end the connection itself as fatal */
  fatal?: unknown
}

/** Whether `error` says the database is out of reach (the request may succeed later). */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (typeof error !== 'object' || error === null) return false
  const { name, code, fatal } = error as DriverError
  // knex: no connection could be had from the pool in time
  if (name === 'KnexTimeoutError') return true
  return fatal === true || (typeof code === 'string' && UNREACHABLE_CODES.has(code))
}

/** Passes a message on at most once per `quietMs`; the others are dropped. */
export function onceEvery(quietMs: number, log: (message: string) => void) {
  let lastLogged = 0
  return (message: string) => {
    const now = Date.now()
    if (now - lastLogged < quietMs) return
    lastLogged = now
    log(message)
  }
}

/**
 * Logs an outage once, not once per request: during an outage every request fails the same way,
 * and a log full of the same line hides everything else.
 */
export function outageLogger(log: (message: string) => void, quietMs = 30_000) {
  const quiet = onceEvery(quietMs, log)
  return (error: unknown) => {
    const { code } = error as DriverError
    const reason = typeof code === 'string' ? code : error instanceof Error ? error.message : ''
    quiet(`The database is not available (${reason}); answering 503 until it is back.`)
  }
}

const CONNECTION_WARNING = /^(Acquire connection error|Connection Error)/

/** Knex warns about every failed connection attempt; during an outage one line per 30 s will do. */
export function quietConnectionWarnings(warn: (message: string) => void, quietMs = 30_000) {
  const quiet = onceEvery(quietMs, warn)
  return (message: string) => (CONNECTION_WARNING.test(message) ? quiet(message) : warn(message))
}
