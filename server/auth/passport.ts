import { Passport } from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { SessionUser } from '../../shared/schemas/auth'
import { toSessionUser, type PeopleService } from '../services/people'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

export type AppPassport = InstanceType<typeof Passport>

/**
 * One passport instance per app (tests build many apps). The session keeps only the person's id;
 * every request reloads them, so a deactivated person or a changed role takes effect at once.
 */
export function createPassport(people: PeopleService): AppPassport {
  const passport = new Passport()
  passport.use(
    new LocalStrategy(
      { usernameField: 'email', passwordField: 'password' },
      (email, password, done) => {
        people
          .verifyCredentials(email, password)
          .then((person) => done(null, person ? toSessionUser(person) : false))
          .catch(done)
      },
    ),
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
