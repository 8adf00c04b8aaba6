import { Passport } from 'passport'
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
 * One passport instance per app (tests build many apps); it keeps the signed-in person in the
 * session (the routes check passwords and codes themselves). The session keeps only the person's id;
 * every request reloads them, so a deactivated person or a changed role takes effect at once.
 */
export function createPassport(people: PeopleService): AppPassport {
  const passport = new Passport()
  passport.serializeUser((user, done) => done(null, user.id))
  passport.deserializeUser((id: number, done) => {
    people
      .find(id)
      .then((person) => done(null, person?.active ? toSessionUser(person) : false))
      .catch(done)
  })
  return passport
}
