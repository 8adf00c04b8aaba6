import type { Request, Response } from 'express'
import { Passport } from 'passport'
import { Strategy as LocalStrategy, type IVerifyOptions } from 'passport-local'
import type { SessionUser } from '../../shared/schemas/auth'
import { toSessionUser, type CredentialCheck, type PeopleService } from '../services/people'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

export type AppPassport = InstanceType<typeof Passport>

/**
 * One passport instance per app (tests build many apps). Its local strategy checks an e-mail
 * address and password (`checkPassword`); the sign-in route then decides between signing the
 * person in and asking for the second factor, so the strategy never starts a session itself.
 * The session keeps only the person's id; every request reloads them, so a deactivated person or
 * a changed role takes effect at once.
 */
export function createPassport(people: PeopleService): AppPassport {
  const passport = new Passport()
  passport.use(
    'password',
    new LocalStrategy({ usernameField: 'email', session: false }, (email, password, done) => {
      people
        .verifyCredentials(email, password)
        .then((check) => {
          const user = check && 'person' in check ? toSessionUser(check.person) : false
          const info: IVerifyOptions & { check?: CredentialCheck } = {
            message: check ? 'checked' : 'refused',
            check,
          }
          done(null, user, info)
        })
        .catch(done)
    }),
  )
  passport.serializeUser((user, done) => done(null, user.id))
  passport.deserializeUser((id: number, done) => {
    people
      .find(id)
      .then((person) => done(null, person?.active ? toSessionUser(person) : false))
      .catch(done)
  })
  return passport
}

/** The password step of a sign-in through the local strategy: the person, expired, or undefined. */
export function checkPassword(
  passport: AppPassport,
  req: Request,
  res: Response,
  credentials: { email: string; password: string },
): Promise<CredentialCheck> {
  // the strategy reads the body: give it what the schema made of it (trimmed, lower-cased)
  req.body = credentials
  return new Promise((resolve, reject) => {
    // what the strategy's verify answered; passport's own note (no e-mail) carries no check
    const answer = (error: unknown, _user: unknown, info?: { check?: CredentialCheck }) =>
      error ? reject(error) : resolve(info?.check)
    passport.authenticate('password', { session: false }, answer)(req, res, reject)
  })
}
