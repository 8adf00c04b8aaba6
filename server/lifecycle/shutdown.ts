import type { Server } from 'node:http'
import type { Knex } from 'knex'

export interface ShutdownTargets {
  /** the listening HTTP server; absent when the signal came before it listened */
  server?: Server
  db: Knex
  /** stops background work that uses the pool (the mail sender); awaited before it closes */
  stopBackground?: () => Promise<void>
  /** stops the private MariaDB this process started; called last */
  stopDatabase?: () => Promise<void>
  /** how long requests in flight may take to finish before their connections are cut */
  graceMs?: number
  log?: (message: string) => void
}

const DEFAULT_GRACE_MS = 10_000
const say = (message: string) => void process.stdout.write(`${message}\n`)

/**
 * Stops accepting connections, lets the requests in flight finish (bounded by `graceMs`), then
 * stops background work (the mail sender finishes the message it is sending), then closes the
 * database pool, then stops the private MariaDB: in that order, so no request or message loses
 * its database half-way and MariaDB never stops under an open connection.
 */
export async function gracefulShutdown(targets: ShutdownTargets): Promise<void> {
  const { server, db, stopDatabase, graceMs = DEFAULT_GRACE_MS, log = say } = targets
  if (server?.listening) {
    const cut = await closeServer(server, graceMs)
    if (cut) log(`Requests still running after ${graceMs / 1000} s were cut off.`)
  }
  await targets.stopBackground?.()
  await db.destroy()
  if (stopDatabase) {
    await stopDatabase()
    log('Private MariaDB stopped.')
  }
}

/** Resolves once every connection is closed; answers whether some had to be cut off. */
function closeServer(server: Server, graceMs: number): Promise<boolean> {
  return new Promise((closed) => {
    let cut = false
    // A keep-alive connection would otherwise stay open, idle, for its whole timeout.
    const sweep = setInterval(() => server.closeIdleConnections(), 100)
    const deadline = setTimeout(() => {
      cut = true
      server.closeAllConnections()
    }, graceMs)
    server.on('request', (_req, res) => {
      if (!res.headersSent) res.setHeader('Connection', 'close')
    })
    server.close(() => {
      clearInterval(sweep)
      clearTimeout(deadline)
      closed(cut)
    })
    server.closeIdleConnections()
  })
}

/**
 * Runs `shutdown` once on SIGTERM or SIGINT and exits: 0 when it went through, 1 when it failed.
 * A repeated signal changes nothing: Ctrl-C arrives twice under `npm start` (from the terminal
 * and passed on), and the grace period already bounds how long shutting down takes.
 */
export function shutDownOnSignals(
  shutdown: (signal: NodeJS.Signals) => Promise<void>,
  log: (message: string) => void = say,
): void {
  let stopping = false
  const onSignal = (signal: NodeJS.Signals) => {
    if (stopping) return
    stopping = true
    log(`${signal} received, shutting down…`)
    shutdown(signal).then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error)
        process.exit(1)
      },
    )
  }
  process.on('SIGTERM', onSignal)
  process.on('SIGINT', onSignal)
}
