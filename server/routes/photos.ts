import { rm } from 'node:fs/promises'
import { Router, type Request, type Response } from 'express'
import type { Knex } from 'knex'
import { z } from 'zod/mini'
import { Id } from '../../shared/schemas/common'
import {
  MAX_PHOTO_BYTES,
  PhotoListQuery,
  PhotoUpdate,
  PhotoUploadFields,
} from '../../shared/schemas/photos'
import { allowOnCase, caseFileOf, childCaseLoader } from '../middleware/case-loader'
import { currentUser } from '../middleware/require-auth'
import { singleUploadToDisk } from '../middleware/upload'
import { parseOrThrow, validate } from '../middleware/validate'
import type { CaseService } from '../services/cases'
import type { ServiceContext } from '../services/context'
import { caseOfPhoto, type PhotoCopy, type PhotoService } from '../services/photos/photos'

const contextOf = (req: Request, db: Knex): ServiceContext => ({ actor: currentUser(req), db })

/** `/api/cases/:id/photos`, behind the case loader. */
export function casePhotoRoutes(db: Knex, photos: PhotoService, incomingDir: string): Router {
  const router = Router({ mergeParams: true })
  router.get('/', validate('query', PhotoListQuery), async (req, res) => {
    const { sampleId } = res.locals.query as z.output<typeof PhotoListQuery>
    res.json({ data: await photos.list(contextOf(req, db), caseFileOf(res).id, sampleId) })
  })
  router.post(
    '/',
    allowOnCase('case.editPhotos'),
    singleUploadToDisk(MAX_PHOTO_BYTES, incomingDir),
    async (req, res) => {
      const file = req.file as Express.Multer.File
      try {
        const { sampleId } = parseOrThrow(PhotoUploadFields, { ...req.body }, 'form')
        const photo = await photos.ingest(contextOf(req, db), caseFileOf(res).id, file, sampleId)
        res.status(201).json({ data: photo })
      } finally {
        await rm(file.path, { force: true })
      }
    },
  )
  return router
}

const photoIdOf = (req: Request) => z.parse(z.looseObject({ id: Id }), req.params).id

/**
 * Files never change once stored, so a viewer's browser may keep them (privately); keyed to the
 * session cookie too, so whoever signs in next on the same browser is asked for again.
 */
function sendCopy(res: Response, mediaType: string, bytes: Buffer, fileName?: string) {
  res.setHeader('Content-Type', mediaType)
  res.setHeader('Cache-Control', 'private, max-age=31536000, immutable')
  res.setHeader('Vary', 'Cookie')
  res.setHeader('X-Content-Type-Options', 'nosniff')
  res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox")
  if (fileName) {
    res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${encodeURIComponent(fileName)}`)
  }
  res.send(bytes)
}

/** `/api/photos/:id…`: finds the photo's case, then the same loader and checks. */
export function photoRoutes(db: Knex, cases: CaseService, photos: PhotoService): Router {
  const router = Router()
  router.use('/:id', childCaseLoader(db, cases, caseOfPhoto))
  router.get('/:id', async (req, res) => {
    res.json({ data: await photos.get(contextOf(req, db), caseFileOf(res).id, photoIdOf(req)) })
  })
  router.patch(
    '/:id',
    allowOnCase('case.editPhotos'),
    validate('body', PhotoUpdate),
    async (req, res) => {
      const change = res.locals.body as PhotoUpdate
      const ctx = contextOf(req, db)
      res.json({ data: await photos.update(ctx, caseFileOf(res).id, photoIdOf(req), change) })
    },
  )
  for (const copy of ['original', 'display', 'thumbnail'] as PhotoCopy[]) {
    router.get(`/:id/${copy}`, async (req, res) => {
      const ctx = contextOf(req, db)
      const found = await photos.readCopy(ctx, caseFileOf(res).id, photoIdOf(req), copy)
      const name = copy === 'original' ? found.photo.fileName : undefined
      sendCopy(res, found.mediaType, found.bytes, name)
    })
  }
  router.get('/:id/figure', async (req, res) => {
    const { photo, png } = await photos.figure(
      contextOf(req, db),
      caseFileOf(res).id,
      photoIdOf(req),
    )
    res.setHeader('Content-Type', 'image/png')
    res.setHeader('Cache-Control', 'private, no-cache')
    res.setHeader('X-Content-Type-Options', 'nosniff')
    const name = encodeURIComponent(`figure-${photo.id}.png`)
    res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${name}`)
    res.send(png)
  })
  return router
}
