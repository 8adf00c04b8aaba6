import { Router } from 'express'
import type { Db } from '../db/knex'

export function healthRoutes(db: Db): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    try {
      const [rows] = (await db.raw('SELECT VERSION() AS version')) as [{ version: string }[]]
      res.json({ data: { status: 'ok', database: { connected: true, version: rows[0]?.version } } })
    } catch {
      res.status(503).json({
        error: { code: 'database_unavailable', message: 'The database does not answer.' },
      })
    }
  })
  return router
}
