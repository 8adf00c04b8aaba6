import { ConnectSessionKnexStore } from 'connect-session-knex'
import type { SessionData } from 'express-session'

/** A session's stored expiry is moved on at most this often: a write per request costs too much. */
export const TOUCH_INTERVAL_MS = 60_000

/**
 * The MariaDB session store, writing a rolling session's new expiry only when the last write is
 * more than a minute old. The idle timeout is thereby up to a minute shorter than configured,
 * never longer. Remembered per process, so several processes each write at most once a minute.
 */
export class SessionStore extends ConnectSessionKnexStore {
  private readonly writtenAt = new Map<string, number>()

  override async set(sid: string, session: SessionData, callback?: (err?: unknown) => void) {
    await super.set(sid, session, (error?: unknown) => {
      if (!error) this.remember(sid)
      callback?.(error)
    })
  }

  override async touch(sid: string, session: SessionData, callback?: () => void) {
    const last = this.writtenAt.get(sid)
    if (last !== undefined && Date.now() - last < TOUCH_INTERVAL_MS) {
      callback?.()
      return
    }
    await super.touch(sid, session)
    this.remember(sid)
    callback?.()
  }

  override async destroy(sid: string, callback?: (err?: unknown) => void) {
    this.writtenAt.delete(sid)
    return super.destroy(sid, callback)
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
}
