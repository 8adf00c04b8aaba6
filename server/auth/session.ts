import type { RequestHandler } from 'express'
import session from 'express-session'
import type { Knex } from 'knex'
import type { Config } from '../config'
import { SessionStore } from './session-store'

declare module 'express-session' {
  interface SessionData {
    /** when the person signed in (ms since epoch), for the absolute lifetime */
    signedInAt?: number
  }
}

export interface SessionHandle {
  middleware: RequestHandler
  /** stops the store's periodic clean-up so the process can exit */
  close: () => void
}

/**
 * Sessions live in MariaDB (several API processes can share them). The cookie rolls with every
 * request, which gives the idle timeout (the stored expiry follows at most once a minute); `enforceAbsoluteLifetime` ends a session that is older
 * than the absolute limit however active it is.
 */
/**
 * In production the cookie carries the `__Host-` prefix: browsers then accept it only when it is
 * Secure, for the whole site and from this host alone (no Domain), so a neighbour cannot set it.
 */
export function sessionCookieName(config: Config): string {
  return config.nodeEnv === 'production' ? '__Host-fractolog.sid' : 'fractolog.sid'
}

export function createSessionMiddleware(
  db: Knex,
  config: Config,
  log: (message: string) => void = console.error,
): SessionHandle {
  const cleanupMs = config.nodeEnv === 'test' ? 0 : 10 * 60_000
  const store = new SessionStore({ db, cleanupMs, log })
  const middleware = session({
    name: sessionCookieName(config),
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      path: '/',
      secure: config.nodeEnv === 'production',
      maxAge: config.sessionIdleMinutes * 60_000,
    },
  })
  return { middleware, close: () => store.close() }
}

export function enforceAbsoluteLifetime(config: Config): RequestHandler {
  const limitMs = config.sessionMaxHours * 3_600_000
  return (req, _res, next) => {
    const signedInAt = req.session?.signedInAt
    if (signedInAt === undefined || Date.now() - signedInAt <= limitMs) {
      next()
      return
    }
    // regenerate, not destroy: the old session is removed and the request goes on signed out
    req.session.regenerate((error) => next(error))
  }
}
