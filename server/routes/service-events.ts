import { Router, type Request } from 'express'
import type { Knex } from 'knex'
import { z } from 'zod/mini'
import { Id } from '../../shared/schemas/common'
import {
  MAX_ATTACHMENT_BYTES,
  ServiceEventCreate,
  ServiceEventDelete,
  ServiceEventUpdate,
} from '../../shared/schemas/service-events'
import { allowOnCase, caseFileOf, childCaseLoader } from '../middleware/case-loader'
import { currentUser } from '../middleware/require-auth'
import { singleUpload } from '../middleware/upload'
import { validate } from '../middleware/validate'
import type { CaseService } from '../services/cases'
import type { ServiceContext } from '../services/context'
import type { ServiceEventService } from '../services/service-events'

const EventParams = z.looseObject({ eventId: Id })
type EventParams = z.output<typeof EventParams>

const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })

/** `/api/cases/:id/service-events…`, behind the case loader. */
export function serviceEventRoutes(db: Knex, events: ServiceEventService): Router {
  const router = Router({ mergeParams: true })
  const editors = allowOnCase('case.editHistory')
  const eventId = (res: { locals: Record<string, unknown> }) =>
    (res.locals.params as EventParams).eventId

  router.get('/', async (req, res) => {
    res.json({ data: await events.list(contextOf(req, db), caseFileOf(res).id) })
  })
  router.post('/', editors, validate('body', ServiceEventCreate), async (req, res) => {
    const input = res.locals.body as ServiceEventCreate
    res
      .status(201)
      .json({ data: await events.create(contextOf(req, db), caseFileOf(res).id, input) })
  })
  router.patch(
    '/:eventId',
    editors,
    validate('params', EventParams),
    validate('body', ServiceEventUpdate),
    async (req, res) => {
      const change = res.locals.body as ServiceEventUpdate
      const ctx = contextOf(req, db)
      res.json({ data: await events.update(ctx, caseFileOf(res).id, eventId(res), change) })
    },
  )
  router.delete(
    '/:eventId',
    editors,
    validate('params', EventParams),
    validate('body', ServiceEventDelete),
    async (req, res) => {
      const { version } = res.locals.body as z.output<typeof ServiceEventDelete>
      await events.remove(contextOf(req, db), caseFileOf(res).id, eventId(res), version)
      res.status(204).end()
    },
  )
  router.post(
    '/:eventId/attachments',
    editors,
    validate('params', EventParams),
    singleUpload(MAX_ATTACHMENT_BYTES),
    async (req, res) => {
      const file = req.file as Express.Multer.File
      const ctx = contextOf(req, db)
      res
        .status(201)
        .json({ data: await events.attach(ctx, caseFileOf(res).id, eventId(res), file) })
    },
  )
  return router
}

/** `GET /api/attachments/:id`: finds the attachment's case, then the same loader and checks. */
export function attachmentRoutes(
  db: Knex,
  cases: CaseService,
  events: ServiceEventService,
): Router {
  const router = Router()
  router.get('/:id', childCaseLoader(db, cases, events.caseOfAttachment), async (req, res) => {
    const { id } = z.parse(z.looseObject({ id: Id }), req.params)
    const { info, bytes } = await events.readAttachment(contextOf(req, db), caseFileOf(res).id, id)
    const name = encodeURIComponent(info.fileName)
    res.setHeader('Content-Type', info.mediaType)
    res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${name}`)
    res.setHeader('X-Content-Type-Options', 'nosniff')
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox")
    res.send(bytes)
  })
  return router
}
