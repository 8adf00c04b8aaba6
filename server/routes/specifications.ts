import { Router } from 'express'
import type { Knex } from 'knex'
import { IdParams } from '../../shared/schemas/common'
import { SpecificationCreate, SpecificationUpdate } from '../../shared/schemas/specifications'
import { currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import {
  createSpecification,
  getSpecification,
  listSpecifications,
  updateSpecification,
} from '../services/specifications'

/** `/api/specifications`: staff read the library, administrators keep it. */
export function specificationRoutes(db: Knex): Router {
  const router = Router()
  const manage = requirePermission('specifications.manage')
  router.get('/', requirePermission('specifications.list'), async (_req, res) => {
    res.json({ data: await listSpecifications(db) })
  })
  router.get(
    '/:id',
    requirePermission('specifications.list'),
    validate('params', IdParams),
    async (_req, res) => {
      res.json({ data: await getSpecification(db, (res.locals.params as IdParams).id) })
    },
  )
  router.post('/', manage, validate('body', SpecificationCreate), async (req, res) => {
    const ctx = { actor: currentUser(req), db }
    const input = res.locals.body as SpecificationCreate
    res.status(201).json({ data: await createSpecification(ctx, input) })
  })
  router.patch(
    '/:id',
    manage,
    validate('params', IdParams),
    validate('body', SpecificationUpdate),
    async (req, res) => {
      const ctx = { actor: currentUser(req), db }
      const { id } = res.locals.params as IdParams
      res.json({ data: await updateSpecification(ctx, id, res.locals.body as SpecificationUpdate) })
    },
  )
  return router
}
