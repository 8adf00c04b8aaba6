import { Router } from 'express'
import type { Knex } from 'knex'
import { IdParams } from '../../shared/schemas/common'
import { OutboxListQuery } from '../../shared/schemas/mail'
import { NotFound } from '../errors'
import { listReceivedMail } from '../mail/received-mail'
import { requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import { listOutbox, resendOutboxMessage } from '../services/outbox'

/**
 * `/api/admin/…` for mail: the outbox (queued, sent, failed; resend) and, in demo mode only, what
 * the local SMTP server received. Administrators only.
 */
export function adminMailRoutes(db: Knex, options: { demo: boolean }): Router {
  const router = Router()
  router.use(requirePermission('mail.manage'))
  router.get('/mail', async (_req, res) => {
    if (!options.demo) throw new NotFound('The local mailbox exists only in demo mode.')
    res.json({ data: await listReceivedMail(db) })
  })
  router.get('/outbox', validate('query', OutboxListQuery), async (_req, res) => {
    const { status } = res.locals.query as OutboxListQuery
    res.json({ data: await listOutbox(db, { status }) })
  })
  router.post('/outbox/:id/resend', validate('params', IdParams), async (_req, res) => {
    const { id } = res.locals.params as IdParams
    res.json({ data: await resendOutboxMessage(db, id) })
  })
  return router
}
