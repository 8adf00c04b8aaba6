import { Router } from 'express'
import { SecurityEventQuery } from '../../shared/schemas/security-events'
import type { Db } from '../db/knex'
import { requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { listSecurityEvents } from '../services/security-events'

/** The security trail, for administrators: `?kind=&page=&pageSize=`, newest first. */
export function securityEventRoutes(db: Db): Router {
  const router = Router()
  router.get(
    '/',
    requirePermission('security.audit'),
    validate('query', SecurityEventQuery),
    async (_req, res) => {
      res.json(await listSecurityEvents(db, res.locals.query as SecurityEventQuery))
    },
  )
  return router
}
