import { ConnectSessionKnexStore } from 'connect-session-knex'
import type { SessionData } from 'express-session'
import type { Knex } from 'knex'

/** A session's stored expiry is moved on at most this often: a write per request costs too much. */
export const TOUCH_INTERVAL_MS = 60_000

type Callback<T> = (error: unknown, value?: T) => void

/** Hands the outcome of `work` to the callback, once, and never lets the promise reject. */
function settle<T>(work: Promise<T>, callback: Callback<T> | undefined): Promise<T | undefined> {
  return work.then(
    (value) => {
      callback?.(null, value)
      return value
    },
    (error: unknown) => {
      callback?.(error)
      return undefined
    },
  )
}

export interface SessionStoreOptions {
  db: Knex
  /** how often expired sessions are deleted; 0 never */
  cleanupMs: number
  log: (message: string) => void
}

/**
 * Sessions in MariaDB through connect-session-knex, with two changes.
 *
 * Failures are made harmless: the library answers through the callback and then also rejects
 * the promise it returns, which express-session never looks at, so during a database outage every
 * session read became an unhandled rejection that ended the process, and `touch` did not call
 * back at all, leaving the response hanging. Here every outcome goes to the callback only
 * (express-session passes an error on to the error handler, which answers 503) and the returned
 * promise always resolves.
 *
 * A rolling session's new expiry is written only when the last write is more than a minute old.
 * The idle timeout is thereby up to a minute shorter than configured, never longer. Remembered
 * per process, so several processes each write at most once a minute.
 */
export class SessionStore extends ConnectSessionKnexStore {
  private readonly writtenAt = new Map<string, number>()
  private cleanupTimer: NodeJS.Timeout | undefined

  constructor(private readonly settings: SessionStoreOptions) {
    // The table comes from the migrations; the library's own start-up check and clean-up timer
    // would fail for good if the database were down at that moment, so neither is used.
    super({ knex: settings.db, tableName: 'sessions', createTable: false, cleanupInterval: 0 })
    this.ready = this.ready.catch(() => undefined)
    if (settings.cleanupMs > 0) this.scheduleCleanup()
  }

  override get(sid: string, callback: Callback<SessionData | null>) {
    return settle(
      super.get(sid, () => undefined),
      callback,
    ).then((value) => value ?? null)
  }

  override set(sid: string, session: SessionData, callback?: (error?: unknown) => void) {
    const written = (error: unknown) => {
      if (!error) this.remember(sid)
      callback?.(error)
    }
    return settle(super.set(sid, session), written).then(() => undefined)
  }

  override touch(sid: string, session: SessionData, callback?: (error?: unknown) => void) {
    const last = this.writtenAt.get(sid)
    if (last !== undefined && Date.now() - last < TOUCH_INTERVAL_MS) {
      callback?.()
      return Promise.resolve()
    }
    const written = (error: unknown) => {
      if (!error) this.remember(sid)
      callback?.(error)
    }
    return settle(super.touch(sid, session), written).then(() => undefined)
  }

  override destroy(sid: string, callback?: (error?: unknown) => void) {
    this.writtenAt.delete(sid)
    return settle(super.destroy(sid), callback).then((count) => count ?? 0)
  }

  /** Stops the clean-up timer so the process can exit. */
  close(): void {
    clearTimeout(this.cleanupTimer)
    this.cleanupTimer = undefined
  }

  private remember(sid: string): void {
    const now = Date.now()
    this.writtenAt.set(sid, now)
    // keep the memory bounded: forget writes older than the interval, which no longer matter
    if (this.writtenAt.size > 10_000) {
      for (const [key, at] of this.writtenAt)
        if (now - at >= TOUCH_INTERVAL_MS) this.writtenAt.delete(key)
    }
  }

  private scheduleCleanup(): void {
    this.cleanupTimer = setTimeout(() => void this.removeExpired(), this.settings.cleanupMs)
    this.cleanupTimer.unref()
  }

  private async removeExpired(): Promise<void> {
    try {
      await this.settings.db('sessions').where('expired', '<', new Date()).delete()
    } catch (error) {
      this.settings.log(`Expired sessions were not cleaned up: ${(error as Error).message}`)
    } finally {
      if (this.cleanupTimer) this.scheduleCleanup()
    }
  }
}
