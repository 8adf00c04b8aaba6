import { Router } from 'express'
import { IdParams } from '../../shared/schemas/common'
import { PersonCreate, PersonUpdate } from '../../shared/schemas/people'
import { currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { PeopleService } from '../services/people'
import type { SecondFactorService } from '../services/second-factor'
import { securityContextOf } from '../services/security-events'

export function peopleRoutes(people: PeopleService, secondFactors: SecondFactorService): Router {
  const router = Router()
  router.use(requirePermission('people.manage'))
  router.get('/', async (_req, res) => {
    res.json({ data: await people.list() })
  })
  router.post('/', validate('body', PersonCreate), async (req, res) => {
    const body = res.locals.body as PersonCreate
    const created = await people.create(body, currentUser(req).id, securityContextOf(req))
    res.status(201).json({ data: created })
  })
  router.put(
    '/:id',
    validate('params', IdParams),
    validate('body', PersonUpdate),
    async (req, res) => {
      const { id } = res.locals.params as IdParams
      const body = res.locals.body as PersonUpdate
      const trail = securityContextOf(req)
      res.json({ data: await people.update(id, body, currentUser(req).id, trail) })
    },
  )
  router.post('/:id/reset-password', validate('params', IdParams), async (req, res) => {
    const { id } = res.locals.params as IdParams
    const trail = securityContextOf(req)
    res.json({ data: await people.resetPassword(id, currentUser(req).id, trail) })
  })
  router.post('/:id/reset-second-factor', validate('params', IdParams), async (req, res) => {
    const { id } = res.locals.params as IdParams
    await people.get(id)
    await secondFactors.reset(securityContextOf(req), id)
    res.json({ data: await people.get(id) })
  })
  return router
}

export function staffRoutes(people: PeopleService): Router {
  const router = Router()
  router.get('/', requirePermission('staff.list'), async (_req, res) => {
    res.json({ data: await people.listStaff() })
  })
  return router
}
