import type { Request } from 'express'

declare module 'express-session' {
  interface SessionData {
    /** the password was right and a second factor is awaited (half signed in) */
    pendingSignIn?: { userId: number; email: string; at: number }
    /** the key being set up, until its first code confirms it */
    enrolmentSecret?: string
  }
}

/** A half-finished sign-in is forgotten after this long. */
export const PENDING_SIGN_IN_MS = 5 * 60_000

/** A new session id for the same visitor: the old id (and its stored row) stops working. */
export function regenerateSession(req: Request): Promise<void> {
  return new Promise((done, fail) =>
    req.session.regenerate((error) => (error ? fail(error) : done())),
  )
}

export function saveSession(req: Request): Promise<void> {
  return new Promise((done, fail) => req.session.save((error) => (error ? fail(error) : done())))
}

/** Signs the person in; passport gives the session a new id (keeping its data when asked). */
export function logIn(req: Request, user: Express.User, keepSessionInfo = false): Promise<void> {
  return new Promise((done, fail) =>
    req.logIn(user, { session: true, keepSessionInfo }, (error) => (error ? fail(error) : done())),
  )
}
