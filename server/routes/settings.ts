import { Router } from 'express'
import type { Knex } from 'knex'
import { LaboratorySettingsUpdate } from '../../shared/schemas/laboratory'
import { NoticeSettingsUpdate } from '../../shared/schemas/notice-settings'
import { authorize, currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { readLaboratorySettings, saveLaboratorySettings } from '../services/laboratory-settings'
import { readNoticeSettings, saveNoticeSettings } from '../services/notice-settings'

/**
 * `/api/settings`: the laboratory's particulars (staff read them, administrators change them) and
 * each person's own choice of e-mail notices.
 */
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
  router.get('/notices', async (req, res) => {
    res.json({ data: await readNoticeSettings({ actor: currentUser(req), db }) })
  })
  router.put('/notices', validate('body', NoticeSettingsUpdate), async (req, res) => {
    const ctx = { actor: currentUser(req), db }
    res.json({ data: await saveNoticeSettings(ctx, res.locals.body as NoticeSettingsUpdate) })
  })
  return router
}
