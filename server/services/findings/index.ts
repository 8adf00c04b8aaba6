import type { Knex } from 'knex'
import { can } from '../../../shared/access/policy'
import { blocksOf, checkDocument } from '../../../shared/findings/check-document'
import type { FindingsDocument } from '../../../shared/findings/document'
import { findingsFlags } from '../../../shared/findings/flags'
import type { LiveBlockKind } from '../../../shared/findings/live-blocks'
import { draftFigureSrc, renderFindingsHtml } from '../../../shared/findings/render-html'
import { findingsTemplate } from '../../../shared/findings/template'
import type { FindingsSave, FindingsView } from '../../../shared/schemas/findings'
import { AppError, Forbidden } from '../../errors'
import { recordAudit } from '../audit'
import { findCase, type CaseRecord } from '../cases/case-record'
import type { ServiceContext } from '../context'
import { checkReferences, withdrawnObservations } from './document-references'
import { documentOf, findFindings, findingsAuthors, recordAuthor } from './findings-rows'
import { readLiveBlocks } from './live-blocks'
import { withdrawCurrentApproval } from '../review/approvals'

/** One "findings edited" entry per person per hour of editing, not one per autosave. */
const EDITING_SESSION_MS = 60 * 60 * 1000

export function liveBlockKindsOf(doc: FindingsDocument): LiveBlockKind[] {
  const kinds: LiveBlockKind[] = []
  for (const block of blocksOf(doc)) if (block.type === 'liveBlock') kinds.push(block.attrs.kind)
  return kinds
}

export function createFindingsService(options: { clock?: () => Date } = {}) {
  const clock = options.clock ?? (() => new Date())

  async function view(db: Knex, caseId: number): Promise<FindingsView> {
    const row = await findFindings(db, caseId)
    const doc = row ? documentOf(row) : findingsTemplate()
    const liveBlocks = await readLiveBlocks(db, caseId, liveBlockKindsOf(doc), clock())
    const html = renderFindingsHtml(doc, {
      figureSrc: draftFigureSrc,
      liveBlock: (kind) => liveBlocks[kind] ?? null,
    })
    return {
      doc,
      html,
      version: row?.version ?? 0,
      updatedAt: row?.updatedAt.toISOString() ?? null,
      updatedBy: row?.updatedBy ?? null,
      updatedByName: row?.updatedByName ?? null,
      authors: await findingsAuthors(db, caseId),
      flags: findingsFlags(doc, await withdrawnObservations(db, caseId)),
      liveBlocks,
    }
  }

  async function noteEditingSession(trx: Knex, caseId: number, actorId: number, now: Date) {
    const recent = await trx('audit_events')
      .where({ caseId, actorId, action: 'findings.edited' })
      .where('createdAt', '>', new Date(now.getTime() - EDITING_SESSION_MS))
      .first('id')
    if (!recent) await recordAudit(trx, { caseId, actorId, kind: 'findings.edited' })
  }

  /** Saving an approved draft changes what was approved: the approval lapses, back to drafting. */
  async function withdrawApproval(trx: Knex, record: CaseRecord, actorId: number) {
    await trx('cases')
      .where({ id: record.id })
      .update({ status: 'drafting', version: record.version + 1, updatedAt: trx.fn.now() })
    await withdrawCurrentApproval(trx, record.id, actorId)
    await recordAudit(trx, {
      caseId: record.id,
      actorId,
      kind: 'findings.approval_withdrawn',
      details: {
        from: 'approved',
        to: 'drafting',
        reason: 'The findings were edited after approval; they need review again.',
      },
    })
  }

  async function save(
    { actor, db }: ServiceContext,
    caseId: number,
    input: FindingsSave,
  ): Promise<FindingsView> {
    const checked = checkDocument(input.doc)
    if (!checked.ok)
      throw new AppError('invalid_document', checked.issue.message, { path: checked.issue.path })
    await db.transaction(async (trx) => {
      const record = await findCase(trx, caseId, undefined, { forUpdate: true })
      if (!can(actor, 'case.editFindings', record))
        throw new Forbidden(
          'Only the case’s investigators write its findings, while a draft is open.',
        )
      const current = await findFindings(trx, caseId, true)
      if ((current?.version ?? 0) !== input.version)
        throw new AppError(
          'version_conflict',
          'Someone else saved the findings after you opened them. Your text is kept here: merge it into theirs and save again.',
          { current: await view(trx, caseId) },
        )
      await checkReferences(trx, caseId, checked.doc)
      const columns = {
        doc: JSON.stringify(checked.doc),
        updatedBy: actor.id,
        updatedAt: trx.fn.now(3),
      }
      if (current)
        await trx('findings')
          .where({ caseId })
          .update({ ...columns, version: current.version + 1 })
      else await trx('findings').insert({ ...columns, caseId, version: 1 })
      await recordAuthor(trx, caseId, actor.id)
      await noteEditingSession(trx, caseId, actor.id, clock())
      if (record.status === 'approved') await withdrawApproval(trx, record, actor.id)
    })
    return view(db, caseId)
  }

  return { read: ({ db }: ServiceContext, caseId: number) => view(db, caseId), save }
}

export type FindingsService = ReturnType<typeof createFindingsService>
