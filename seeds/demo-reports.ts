import { renderReportPdf } from '../server/services/reports/pdf'
import type { Knex } from 'knex'
import type { Actor } from '../shared/access/policy'
import type { Block, FindingsDocument } from '../shared/findings/document'
import { findingsTemplate } from '../shared/findings/template'
import type { SectionKey } from '../shared/findings/sections'
import { createFindingsService } from '../server/services/findings'
import { createPhotoService } from '../server/services/photos/photos'
import { createReportService } from '../server/services/reports'
import { createReviewService } from '../server/services/review'
import { addComment, resolveComment } from '../server/services/review/comments'
import type { FileStorage } from '../server/storage/file-storage'
import type { DemoReport } from './demo-scenario'

const paragraph = (text: string): Block => ({
  type: 'paragraph',
  content: [{ type: 'text', text }],
})

/** The template with each section's text filled in, and the live blocks a report shows. */
function draftOf(sections: Partial<Record<SectionKey, string[]>>): FindingsDocument {
  const content: Block[] = []
  for (const block of findingsTemplate().content) {
    if (block.type === 'paragraph' && !block.content) continue
    content.push(block)
    if (block.type !== 'heading' || !block.attrs.section) continue
    for (const text of sections[block.attrs.section] ?? []) content.push(paragraph(text))
    if (block.attrs.section === 'background')
      content.push({ type: 'liveBlock', attrs: { kind: 'service_history' } })
  }
  return { type: 'doc', content }
}

interface People {
  lead: Actor
  reviewer: Actor
  client: Actor
}

/**
 * Takes a demo case from drafting through the real review, issue and amendment steps: the same
 * services the API calls, so the demo's history is one the product could have written.
 */
export async function seedDemoReport(
  db: Knex,
  caseId: number,
  report: DemoReport,
  people: People,
  storage: FileStorage,
) {
  const findings = createFindingsService()
  const review = createReviewService()
  // the demo's reports are laid out in this thread: the seed runs before any request is served
  const photos = createPhotoService({ storage })
  const reports = createReportService({ storage, photos, renderPdf: renderReportPdf })
  const as = (actor: Actor) => ({ actor, db })
  const save = async (doc: FindingsDocument) => {
    const { version } = await findings.read(as(people.lead), caseId)
    await findings.save(as(people.lead), caseId, { doc, version })
  }

  await save(draftOf(report.firstDraft))
  await review.submit(as(people.lead), caseId)
  const comment = await addComment(as(people.reviewer), caseId, report.comment)
  await review.requestRevisions(as(people.reviewer), caseId, report.revisionsReason)
  await save(draftOf(report.revisedDraft))
  await addComment(as(people.lead), caseId, { parentId: comment.id, body: report.commentReply })
  await resolveComment(as(people.lead), caseId, comment.id)
  await review.submit(as(people.lead), caseId)
  await review.approve(as(people.reviewer), caseId)
  const first = await reports.issue(as(people.lead), caseId)
  if (report.acknowledged) await reports.acknowledge(as(people.client), caseId, first)
  if (report.question) {
    const asked = await reports.askQuestion(as(people.client), caseId, first, report.question.ask)
    const ids = { reportId: first, questionId: asked.id }
    await reports.answerQuestion(as(people.lead), caseId, ids, report.question.answer)
  }
  if (report.amendment) {
    await reports.amend(as(people.lead), caseId, report.amendment.reason)
    await save(draftOf(report.amendment.draft))
    await review.submit(as(people.lead), caseId)
    await review.approve(as(people.reviewer), caseId)
    await reports.issue(as(people.lead), caseId)
  }
}
