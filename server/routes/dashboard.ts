import { Router } from 'express'
import type { Knex } from 'knex'
import { currentUser, requirePermission } from '../middleware/require-auth'
import { dashboardFor } from '../services/dashboard'

/** `GET /api/dashboard`: the signed-in person's home page. */
export function dashboardRoutes(db: Knex): Router {
  const router = Router()
  router.get('/', requirePermission('cases.list'), async (req, res) => {
    res.json({ data: await dashboardFor({ actor: currentUser(req), db }) })
  })
  return router
}
