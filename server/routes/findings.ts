import express, { Router } from 'express'
import type { Knex } from 'knex'
import { MAX_DOCUMENT_BYTES } from '../../shared/findings/document'
import { FindingsSave } from '../../shared/schemas/findings'
import { allowOnCase, caseFileOf } from '../middleware/case-loader'
import { hiddenFromClients } from '../middleware/hidden-from-clients'
import { currentUser } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { FindingsService } from '../services/findings'
import { draftPdfRoute, type PdfRenderer } from './report-pdf'
import type { PhotoService } from '../services/photos/photos'

/**
 * A draft may be far larger than the API's usual 100 kB bodies; this parser runs first for the
 * save and the general one then leaves the parsed body alone.
 */
export const findingsBodyParser = express.json({
  limit: MAX_DOCUMENT_BYTES + 64 * 1024,
  strict: false,
})

/** `/api/cases/:id/findings`, behind the case loader. */
export function findingsRoutes(
  db: Knex,
  findings: FindingsService,
  preview?: { photos: PhotoService; render: PdfRenderer },
): Router {
  const router = Router({ mergeParams: true })
  router.use(hiddenFromClients, allowOnCase('case.readFindings'))
  router.get('/', async (req, res) => {
    const actor = currentUser(req)
    res.json({ data: await findings.read({ actor, db }, caseFileOf(res).id) })
  })
  if (preview) router.get('/pdf', draftPdfRoute(db, preview))
  router.put(
    '/',
    allowOnCase('case.editFindings'),
    validate('body', FindingsSave),
    async (req, res) => {
      const input = res.locals.body as FindingsSave
      const actor = currentUser(req)
      res.json({ data: await findings.save({ actor, db }, caseFileOf(res).id, input) })
    },
  )
  return router
}
