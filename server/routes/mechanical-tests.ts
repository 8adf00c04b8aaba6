import { rm } from 'node:fs/promises'
import { Router, type Request, type Response } from 'express'
import type { Knex } from 'knex'
import { z } from 'zod/mini'
import { can } from '../../shared/access/policy'
import { Id } from '../../shared/schemas/common'
import {
  MAX_TENSILE_RECORD_BYTES,
  SpecimenCreate,
  TensileRecordInvalidate,
  TensileRecordRecompute,
  TensileRecordVersion,
} from '../../shared/schemas/mechanical-tests'
import { allowOnCase, caseFileOf } from '../middleware/case-loader'
import { currentUser } from '../middleware/require-auth'
import { singleUploadToDisk } from '../middleware/upload'
import { validate } from '../middleware/validate'
import type { ServiceContext } from '../services/context'
import {
  confirmRecord,
  invalidateRecord,
  readRecordFile,
  recomputeRecord,
  uploadRecord,
  type RecordDeps,
} from '../services/mechanical-tests/records'
import { createSpecimen, listSpecimens } from '../services/mechanical-tests/specimens'

const SpecimenParams = z.looseObject({ specimenId: Id })
const RecordParams = z.looseObject({ recordId: Id })
const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })
const caseIdOf = (res: Response) => caseFileOf(res).id
const recordIdOf = (res: Response) => (res.locals.params as { recordId: number }).recordId

/** `/api/cases/:id/specimens…`, behind the case loader. */
/** The records' dependencies, and where uploads wait while they are checked and analysed. */
export type RecordRouteDeps = RecordDeps & { incomingDir: string }

export function specimenRoutes(db: Knex, deps: RecordRouteDeps): Router {
  const { incomingDir } = deps
  const router = Router({ mergeParams: true })
  const recorders = allowOnCase('case.recordTests')
  router.get('/', async (req, res) => {
    res.json({ data: await listSpecimens(contextOf(req, db), caseIdOf(res)) })
  })
  router.post('/', recorders, validate('body', SpecimenCreate), async (req, res) => {
    const input = res.locals.body as SpecimenCreate
    res.status(201).json({ data: await createSpecimen(contextOf(req, db), caseIdOf(res), input) })
  })
  router.post(
    '/:specimenId/tensile-records',
    recorders,
    validate('params', SpecimenParams),
    singleUploadToDisk(MAX_TENSILE_RECORD_BYTES, incomingDir),
    async (req, res) => {
      const { specimenId } = res.locals.params as { specimenId: number }
      const file = req.file as Express.Multer.File
      const ids = { caseId: caseIdOf(res), specimenId }
      const body = req.body as Record<string, unknown> | undefined
      try {
        const upload = { originalname: file.originalname, path: file.path }
        const data = await uploadRecord(deps, contextOf(req, db), ids, upload, body?.options)
        res.status(201).json({ data })
      } finally {
        await rm(file.path, { force: true })
      }
    },
  )
  return router
}

/** `/api/cases/:id/tensile-records/:recordId…`: recompute, invalidate, confirm, the original. */
export function tensileRecordRoutes(db: Knex, deps: RecordDeps): Router {
  const router = Router({ mergeParams: true })
  const params = validate('params', RecordParams)
  router.get('/:recordId/file', allowOnCase('case.viewInternal'), params, async (_req, res) => {
    const { row, bytes } = await readRecordFile(deps, db, caseIdOf(res), recordIdOf(res))
    const name = encodeURIComponent(row.fileName)
    res.setHeader('Content-Type', 'text/plain; charset=utf-8')
    res.setHeader('Content-Disposition', `attachment; filename*=UTF-8''${name}`)
    res.setHeader('X-Content-Type-Options', 'nosniff')
    res.send(bytes)
  })
  router.post(
    '/:recordId/recompute',
    allowOnCase('case.recordTests'),
    params,
    validate('body', TensileRecordRecompute),
    async (req, res) => {
      const change = res.locals.body as TensileRecordRecompute
      const ctx = contextOf(req, db)
      res.json({ data: await recomputeRecord(deps, ctx, caseIdOf(res), recordIdOf(res), change) })
    },
  )
  router.post(
    '/:recordId/invalidate',
    allowOnCase('case.recordTests'),
    params,
    validate('body', TensileRecordInvalidate),
    async (req, res) => {
      const input = res.locals.body as TensileRecordInvalidate
      const mayChangeConfirmed = can(currentUser(req), 'case.confirmTests', caseFileOf(res))
      const ctx = contextOf(req, db)
      const data = await invalidateRecord(ctx, caseIdOf(res), recordIdOf(res), {
        ...input,
        mayChangeConfirmed,
      })
      res.json({ data })
    },
  )
  router.post(
    '/:recordId/confirm',
    allowOnCase('case.confirmTests'),
    params,
    validate('body', TensileRecordVersion),
    async (req, res) => {
      const { version } = res.locals.body as { version: number }
      const ctx = contextOf(req, db)
      res.json({ data: await confirmRecord(ctx, caseIdOf(res), recordIdOf(res), version) })
    },
  )
  return router
}
