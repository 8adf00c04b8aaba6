import { Router } from 'express'
import { SecondFactorConfirmRequest } from '../../shared/schemas/auth'
import { ValidationError } from '../errors'
import { currentUser, requirePasswordSet, requireSignedIn } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { toSessionUser, type PeopleService } from '../services/people'
import type { SecondFactorService } from '../services/second-factor'
import { securityContextOf } from '../services/security-events'
import { logIn } from '../auth/session-steps'

/**
 * Setting up one's second factor: a new key (QR code and text), then a first code to confirm
 * it, which answers the ten recovery codes, shown once.
 */
export function secondFactorEnrolmentRoutes(deps: {
  people: PeopleService
  secondFactors: SecondFactorService
}) {
  const router = Router()
  router.use(requireSignedIn, requirePasswordSet)
  router.post('/', async (req, res) => {
    const enrolment = await deps.secondFactors.begin(currentUser(req).id)
    req.session.enrolmentSecret = enrolment.secret
    res.json({ data: enrolment })
  })
  router.post('/confirm', validate('body', SecondFactorConfirmRequest), async (req, res) => {
    const secret = req.session.enrolmentSecret
    if (!secret)
      throw new ValidationError('Start the set-up again: no key is waiting to be confirmed.')
    const { code } = res.locals.body as SecondFactorConfirmRequest
    const trail = { ...securityContextOf(req), actorId: currentUser(req).id }
    const recoveryCodes = await deps.secondFactors.confirm(trail, secret, code)
    delete req.session.enrolmentSecret
    const user = toSessionUser(await deps.people.get(trail.actorId))
    // a new session id now that the session stands on two factors
    await logIn(req, user, true)
    res.json({ data: { user, recoveryCodes } })
  })
  return router
}
