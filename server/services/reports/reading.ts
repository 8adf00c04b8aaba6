import type { FindingsDocument } from '../../../shared/findings/document'
import type { LiveBlockSnapshots } from '../../../shared/findings/live-blocks'
import { organisationScope } from '../../../shared/access/policy'
import type { ReportView } from '../../../shared/schemas/reports'
import { AppError, NotFound } from '../../errors'
import type { FileStorage } from '../../storage/file-storage'
import { recordAudit } from '../audit'
import type { CaseRecord } from '../cases/case-record'
import type { ServiceContext } from '../context'
import { contentSha256 } from '../review/content-hash'
import { acknowledgementsOf, questionThread } from './questions'
import {
  figureRowsOf,
  findReportRow,
  readableReports,
  reportSummaries,
  rowHashOf,
  type FigureRow,
  type ReportRow,
} from './report-rows'

/** Refuses to serve what no longer matches its fingerprint, and records that it happened. */
async function integrityFailure(
  { actor, db }: ServiceContext,
  row: ReportRow,
  part: string,
): Promise<never> {
  const details = { reportId: row.id, number: row.number, revision: row.revision, part }
  await recordAudit(db, {
    caseId: row.caseId,
    actorId: actor.id,
    kind: 'report.integrity_failed',
    details,
  })
  throw new AppError(
    'integrity_error',
    'This report revision does not match its recorded fingerprint, so it was not served. The laboratory has been notified in the case activity.',
    { reportId: row.id, revision: row.revision },
  )
}

/** The revision, re-checked: sealed, its content hash and its whole-row hash as recorded. */
async function checkedReport(ctx: ServiceContext, caseId: number, reportId: number) {
  const row = await findReportRow(ctx.db, reportId)
  if (!row || row.caseId !== caseId) throw new NotFound('No such report.')
  const figures = await figureRowsOf(ctx.db, reportId)
  if (!row.rowSha256 || rowHashOf(row, figures) !== row.rowSha256)
    await integrityFailure(ctx, row, 'stored revision')
  let doc: FindingsDocument | undefined
  try {
    doc = JSON.parse(row.doc) as FindingsDocument
  } catch {
    doc = undefined
  }
  if (!doc || contentSha256(doc) !== row.contentSha256) await integrityFailure(ctx, row, 'content')
  return { row, figures, doc: doc as FindingsDocument }
}

export function createReportReading(storage: FileStorage) {
  function list({ actor, db }: ServiceContext, caseId: number) {
    return reportSummaries(db, caseId, actor.id)
  }

  function readable({ actor, db }: ServiceContext) {
    return readableReports(db, actor.id, organisationScope(actor))
  }

  async function get(
    ctx: ServiceContext,
    record: CaseRecord,
    reportId: number,
  ): Promise<ReportView> {
    const { row, figures, doc } = await checkedReport(ctx, record.id, reportId)
    const summary = (await list(ctx, record.id)).find((item) => item.id === reportId)
    if (!summary) throw new NotFound('No such report.')
    return {
      ...summary,
      caseNumber: record.number,
      caseTitle: record.title,
      doc,
      html: row.html,
      liveBlocks: JSON.parse(row.liveBlocks) as LiveBlockSnapshots,
      figures: figures.map(({ figureId, sha256, size }) => ({ figureId, sha256, size })),
      rowSha256: row.rowSha256,
      acknowledgements: await acknowledgementsOf(ctx.db, reportId),
      questions: await questionThread(ctx.db, reportId),
    }
  }

  /** A figure's bytes as rendered at issue, after the revision and the file pass their checks. */
  async function figure(ctx: ServiceContext, caseId: number, reportId: number, figureId: string) {
    const { row, figures } = await checkedReport(ctx, caseId, reportId)
    const found: FigureRow | undefined = figures.find((item) => item.figureId === figureId)
    if (!found) throw new NotFound('No such figure in this report.')
    try {
      return await storage.read({ key: found.storageKey, sha256: found.sha256 })
    } catch {
      return integrityFailure(ctx, row, `figure ${figureId}`)
    }
  }

  /** The PDF made at issue, served as stored once the revision and the file pass their checks. */
  async function pdf(ctx: ServiceContext, caseId: number, reportId: number) {
    const { row } = await checkedReport(ctx, caseId, reportId)
    const stored = (await ctx.db('report_pdfs').where({ reportId }).first()) as
      { storageKey: string; sha256: string } | undefined
    if (!stored) throw new NotFound('This revision has no PDF.')
    try {
      const bytes = await storage.read({ key: stored.storageKey, sha256: stored.sha256 })
      return { bytes, fileName: `${row.number}-${row.revision}.pdf` }
    } catch {
      return integrityFailure(ctx, row, 'PDF')
    }
  }

  return { list, readable, get, figure, pdf }
}
