import { Router } from 'express'
import { IdParams } from '../../shared/schemas/common'
import { OrganisationCreate, OrganisationUpdate } from '../../shared/schemas/organisations'
import { organisationScope } from '../../shared/access/policy'
import { authorize, currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { OrganisationService } from '../services/organisations'
import { securityContextOf } from '../services/security-events'

export function organisationRoutes(organisations: OrganisationService): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const user = authorize(req, 'organisations.list')
    res.json({ data: await organisations.list(organisationScope(user)) })
  })
  router.post(
    '/',
    requirePermission('organisations.manage'),
    validate('body', OrganisationCreate),
    async (req, res) => {
      const input = res.locals.body as OrganisationCreate
      res.status(201).json({ data: await organisations.create(input, currentUser(req).id) })
    },
  )
  router.put(
    '/:id',
    requirePermission('organisations.manage'),
    validate('params', IdParams),
    validate('body', OrganisationUpdate),
    async (req, res) => {
      const { id } = res.locals.params as IdParams
      const input = res.locals.body as OrganisationUpdate
      const trail = securityContextOf(req)
      res.json({ data: await organisations.update(id, input, currentUser(req).id, trail) })
    },
  )
  return router
}
