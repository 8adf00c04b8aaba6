import type { RequestHandler, Response } from 'express'
import type { Knex } from 'knex'
import { caseFileOf } from '../middleware/case-loader'
import { currentUser } from '../middleware/require-auth'
import type { PhotoService } from '../services/photos/photos'
import type { ReportPdfInput } from '../services/reports/pdf'
import { draftPdfInput } from '../services/reports/pdf-input'

export type PdfRenderer = (input: ReportPdfInput) => Promise<Buffer>

/** A report's PDF as the answer: shown in the browser, saved under the report's own name. */
export function sendPdf(res: Response, pdf: Buffer, fileName: string): void {
  res.setHeader('Content-Type', 'application/pdf')
  res.setHeader('Cache-Control', 'private, no-store')
  res.setHeader('X-Content-Type-Options', 'nosniff')
  const name = encodeURIComponent(fileName)
  res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${name}`)
  res.send(pdf)
}

/**
 * `GET /api/cases/:id/findings/pdf`: the draft as it would print now, watermarked on every page
 * and never stored. Sits behind the findings router's checks (staff who may read the draft).
 */
export function draftPdfRoute(
  db: Knex,
  deps: { photos: PhotoService; render: PdfRenderer },
): RequestHandler {
  return async (req, res) => {
    const record = caseFileOf(res)
    const input = await draftPdfInput({ actor: currentUser(req), db }, record, deps.photos)
    const pdf = await deps.render(input)
    sendPdf(res, pdf, `${input.report.number}-draft.pdf`)
  }
}
