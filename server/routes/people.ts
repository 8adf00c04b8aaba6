import { Router } from 'express'
import { IdParams } from '../../shared/schemas/common'
import { PersonCreate, PersonUpdate } from '../../shared/schemas/people'
import { currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { PeopleService } from '../services/people'

export function peopleRoutes(people: PeopleService): Router {
  const router = Router()
  router.use(requirePermission('people.manage'))
  router.get('/', async (_req, res) => {
    res.json({ data: await people.list() })
  })
  router.post('/', validate('body', PersonCreate), async (req, res) => {
    const created = await people.create(res.locals.body as PersonCreate, currentUser(req).id)
    res.status(201).json({ data: created })
  })
  router.put(
    '/:id',
    validate('params', IdParams),
    validate('body', PersonUpdate),
    async (req, res) => {
      const { id } = res.locals.params as IdParams
      res.json({
        data: await people.update(id, res.locals.body as PersonUpdate, currentUser(req).id),
      })
    },
  )
  router.post('/:id/reset-password', validate('params', IdParams), async (req, res) => {
    const { id } = res.locals.params as IdParams
    res.json({ data: await people.resetPassword(id, currentUser(req).id) })
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
