import { Router } from 'express'
import type { Knex } from 'knex'
import { LaboratorySettingsUpdate } from '../../shared/schemas/laboratory'
import { authorize, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { readLaboratorySettings, saveLaboratorySettings } from '../services/laboratory-settings'

/** `/api/settings`: the laboratory's particulars (staff read them, administrators change them). */
export function settingsRoutes(db: Knex): Router {
  const router = Router()
  router.get('/laboratory', async (req, res) => {
    authorize(req, 'settings.read')
    res.json({ data: await readLaboratorySettings(db) })
  })
  router.put(
    '/laboratory',
    requirePermission('settings.manage'),
    validate('body', LaboratorySettingsUpdate),
    async (req, res) => {
      const actor = authorize(req, 'settings.manage')
      const input = res.locals.body as LaboratorySettingsUpdate
      res.json({ data: await saveLaboratorySettings({ actor, db }, input) })
    },
  )
  return router
}
