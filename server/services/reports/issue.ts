import type { Knex } from 'knex'
import type { FindingsDocument } from '../../../shared/findings/document'
import { figuresOf } from '../../../shared/findings/figures'
import type { LiveBlockSnapshots } from '../../../shared/findings/live-blocks'
import { renderFindingsHtml } from '../../../shared/findings/render-html'
import { reportNumberOf, revisionLetter } from '../../../shared/schemas/reports'
import { AppError } from '../../errors'
import type { FileStorage, StoredFile } from '../../storage/file-storage'
import { findCase, type CaseRecord } from '../cases/case-record'
import type { ServiceContext } from '../context'
import { liveBlockKindsOf } from '../findings'
import { documentOf, findFindings } from '../findings/findings-rows'
import { readLiveBlocks } from '../findings/live-blocks'
import type { PhotoService } from '../photos/photos'
import { currentApprovalRow } from '../review/approvals'
import { contentSha256 } from '../review/content-hash'
import { guardAction } from '../review/guard'
import { notifyIssued } from '../review/notify'
import { issuedPdfInput } from './pdf-input'
import type { ReportPdfInput } from './pdf'
import { figureRowsOf, findReportRow, rowHashOf } from './report-rows'

export const reportFigureSrc = (reportId: number, figureId: string) =>
  `/api/reports/${reportId}/figures/${figureId}`

const notApproved = (message: string) => new AppError('not_approved', message)

interface IssueDeps {
  storage: FileStorage
  photos: PhotoService
  clock: () => Date
  /** lays out the revision's PDF, made once at issue */
  renderPdf: (input: ReportPdfInput) => Promise<Buffer>
}

/** The approved content, refused unless it is exactly what the reviewer approved. */
async function approvedContent(trx: Knex, caseId: number) {
  const approval = await currentApprovalRow(trx, caseId, true)
  const findings = await findFindings(trx, caseId, true)
  if (!approval || !findings) throw notApproved('The draft has no standing approval.')
  const doc = documentOf(findings)
  const sha256 = contentSha256(doc)
  if (sha256 !== approval.contentSha256)
    throw notApproved('The draft changed after it was approved; it needs approval again.')
  return { approval, doc, sha256 }
}

/** The rendered bytes of every figure as it is now (marks and scale bar drawn in), stored. */
async function freezeFigures(
  ctx: ServiceContext,
  deps: IssueDeps,
  record: CaseRecord,
  reportId: number,
  doc: FindingsDocument,
  stored: StoredFile[],
): Promise<ReportPdfInput['figures']> {
  const frozen: ReportPdfInput['figures'] = {}
  const seen = new Set<string>()
  for (const figure of figuresOf(doc)) {
    if (seen.has(figure.attrs.figureId)) continue
    seen.add(figure.attrs.figureId)
    const { png } = await deps.photos.figure(ctx, record.id, figure.attrs.photoId)
    const file = await deps.storage.put(png)
    stored.push(file)
    frozen[figure.attrs.figureId] = { png }
    await ctx.db('report_figures').insert({
      reportId,
      figureId: figure.attrs.figureId,
      photoId: figure.attrs.photoId,
      storageKey: file.key,
      sha256: file.sha256,
      size: file.size,
    })
  }
  return frozen
}

/** The revision's PDF, laid out once from its frozen parts and stored with its SHA-256. */
async function storePdf(
  trx: Knex,
  deps: IssueDeps,
  reportId: number,
  input: ReportPdfInput,
  stored: StoredFile[],
) {
  const file = await deps.storage.put(await deps.renderPdf(input))
  stored.push(file)
  await trx('report_pdfs').insert({
    reportId,
    storageKey: file.key,
    sha256: file.sha256,
    size: file.size,
  })
}

/** Writes the HTML (pointing at the report's own figure routes), then seals the row by its hash. */
async function sealReport(
  trx: Knex,
  reportId: number,
  doc: FindingsDocument,
  live: LiveBlockSnapshots,
) {
  const html = renderFindingsHtml(doc, {
    figureSrc: (figure) => reportFigureSrc(reportId, figure.attrs.figureId),
    liveBlock: (kind) => live[kind] ?? null,
  })
  await trx('reports').where({ id: reportId }).update({ html })
  const row = await findReportRow(trx, reportId)
  if (!row) throw new Error('the report row vanished while it was issued')
  const rowSha256 = rowHashOf(row, await figureRowsOf(trx, reportId))
  await trx('reports').where({ id: reportId }).update({ rowSha256 })
  return { row, rowSha256 }
}

/** approved → issued: the next revision of `<case number>-R`, frozen whole. */
async function issueIn(ctx: ServiceContext, deps: IssueDeps, caseId: number, stored: StoredFile[]) {
  const { actor, db: trx } = ctx
  const record = await findCase(trx, caseId, undefined, { forUpdate: true })
  guardAction(actor, 'case.issue', record, ['approved'], 'not_approved')
  const { approval, doc, sha256 } = await approvedContent(trx, caseId)
  const earlier = (await trx('reports').where({ caseId }).count({ n: '*' })) as [{ n: number }]
  const amendment = (await trx('amendments')
    .where({ caseId })
    .whereNull('reportId')
    .orderBy('id', 'desc')
    .first()) as { id: number; replacesReportId: number; reason: string } | undefined
  const issuedAt = deps.clock()
  const live = await readLiveBlocks(trx, caseId, liveBlockKindsOf(doc), issuedAt)
  const [reportId] = (await trx('reports').insert({
    caseId,
    number: reportNumberOf(record.number),
    revision: revisionLetter(Number(earlier[0].n)),
    replacesReportId: amendment?.replacesReportId ?? null,
    amendmentReason: amendment?.reason ?? null,
    doc: JSON.stringify(doc),
    html: '',
    liveBlocks: JSON.stringify(live),
    contentSha256: sha256,
    approvedBy: approval.approverId,
    approvedAt: approval.approvedAt,
    issuedBy: actor.id,
    issuedAt,
  })) as number[]
  const id = reportId as number
  const figures = await freezeFigures(ctx, deps, record, id, doc, stored)
  const { row, rowSha256 } = await sealReport(trx, id, doc, live)
  const replaced = amendment
    ? ((await trx('reports').where({ id: amendment.replacesReportId }).first('revision')) as {
        revision: string
      })
    : undefined
  const pdfInput = await issuedPdfInput(trx, record, {
    revision: row.revision,
    issuedAt,
    replaces:
      amendment && replaced ? { revision: replaced.revision, reason: amendment.reason } : null,
    doc,
    figures,
    liveBlocks: live,
    approverId: approval.approverId,
    issuerId: actor.id,
  })
  await storePdf(trx, deps, id, pdfInput, stored)
  await trx('approvals').where({ id: approval.id }).update({ reportId: id })
  if (amendment) await trx('amendments').where({ id: amendment.id }).update({ reportId: id })
  await trx('cases')
    .where({ id: caseId })
    .update({ status: 'issued', version: record.version + 1, updatedAt: trx.fn.now() })
  // the authors the four-eyes rule reads are those since the last issued revision
  await trx('findings_authors').where({ caseId }).delete()
  const details = {
    from: 'approved',
    to: 'issued',
    reportId: id,
    number: row.number,
    revision: row.revision,
    contentSha256: sha256,
    rowSha256,
    replacesReportId: row.replacesReportId,
  }
  await notifyIssued(trx, { caseId, actorId: actor.id, details })
  return id
}

export async function issueReport(
  { actor, db }: ServiceContext,
  deps: IssueDeps,
  caseId: number,
): Promise<number> {
  const stored: StoredFile[] = []
  try {
    return await db.transaction((trx) => issueIn({ actor, db: trx }, deps, caseId, stored))
  } catch (error) {
    await Promise.all(stored.map((file) => deps.storage.remove(file.key)))
    throw error
  }
}
