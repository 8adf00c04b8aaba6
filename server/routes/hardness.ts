import { Router } from 'express'
import type { Knex } from 'knex'
import { HardnessCreate } from '../../shared/schemas/hardness'
import { allowOnCase, caseFileOf } from '../middleware/case-loader'
import { hiddenFromClients } from '../middleware/hidden-from-clients'
import { currentUser } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { listHardness, recordHardness } from '../services/hardness'

/** `/api/cases/:id/hardness`, behind the case loader: the lab's readings, for staff only. */
export function hardnessRoutes(db: Knex): Router {
  const router = Router({ mergeParams: true })
  router.use(hiddenFromClients)
  router.get('/', async (req, res) => {
    const ctx = { actor: currentUser(req), db }
    res.json({ data: await listHardness(ctx, caseFileOf(res).id) })
  })
  router.post(
    '/',
    allowOnCase('case.recordTests'),
    validate('body', HardnessCreate),
    async (req, res) => {
      const ctx = { actor: currentUser(req), db }
      const input = res.locals.body as HardnessCreate
      res.status(201).json({ data: await recordHardness(ctx, caseFileOf(res).id, input) })
    },
  )
  return router
}
