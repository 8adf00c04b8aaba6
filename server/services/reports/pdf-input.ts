import type { Knex } from 'knex'
import type { FindingsDocument } from '../../../shared/findings/document'
import type { LiveBlockSnapshots } from '../../../shared/findings/live-blocks'
import { figuresOf } from '../../../shared/findings/figures'
import { findingsTemplate } from '../../../shared/findings/template'
import type { CaseRecord } from '../cases/case-record'
import type { ServiceContext } from '../context'
import { liveBlockKindsOf } from '../findings'
import { documentOf, findFindings } from '../findings/findings-rows'
import { readLiveBlocks } from '../findings/live-blocks'
import { readLaboratorySettings } from '../laboratory-settings'
import type { PhotoService } from '../photos/photos'
import { conformityStatement } from './conformity-statement'
import type { PersonOnReport, ReportPdfInput } from './pdf'
import { reportDates } from './report-dates'

/** The report number of a case: its case number with `-R` (revisions are lettered A, B, …). */
export const reportNumberOf = (caseNumber: string) => `${caseNumber}-R`

async function person(db: Knex, id: number | null, role: string): Promise<PersonOnReport | null> {
  if (id === null) return null
  const row = (await db('users').where({ id }).first('name')) as { name: string } | undefined
  return row ? { name: row.name, role } : null
}

/** Each figure's PNG as the photo's figure export draws it now; one that cannot be read is left out. */
async function currentFigures(
  ctx: ServiceContext,
  caseId: number,
  photos: PhotoService,
  figures: { figureId: string; photoId: number }[],
): Promise<ReportPdfInput['figures']> {
  const out: ReportPdfInput['figures'] = {}
  for (const { figureId, photoId } of figures) {
    if (out[figureId]) continue
    try {
      out[figureId] = { png: (await photos.figure(ctx, caseId, photoId)).png }
    } catch {
      // a photo gone or unreadable shows as a marked gap in the preview, never stops it
    }
  }
  return out
}

async function observationsOf(db: Knex, caseId: number) {
  const rows = (await db('observations')
    .where({ caseId })
    .orderBy('number')
    .select('number', 'text', 'withdrawnAt')) as {
    number: number
    text: string
    withdrawnAt: Date | null
  }[]
  return rows.map((row) => ({
    number: row.number,
    text: row.text,
    withdrawn: row.withdrawnAt !== null,
  }))
}

/** What the report says of the case whatever its revision: laboratory, case, dates, people. */
async function caseParts(db: Knex, record: CaseRecord) {
  return {
    laboratory: await readLaboratorySettings(db),
    case: {
      number: record.number,
      title: record.title,
      clientName: record.organisationName,
      clientReference: record.clientReference,
      component: record.component,
      material: record.material,
    },
    dates: await reportDates(db, record.id, record.receivedOn),
    observations: await observationsOf(db, record.id),
    conformity: await conformityStatement(db, record.id),
  }
}

export interface IssuedParts {
  revision: string
  issuedAt: Date
  replaces: { revision: string; reason: string } | null
  doc: FindingsDocument
  figures: ReportPdfInput['figures']
  liveBlocks: LiveBlockSnapshots
  approverId: number
  issuerId: number
}

/**
 * An issued revision's PDF input, made once at issue inside its transaction: the frozen
 * document, figures and live blocks, with the approver as reviewer and the issuer as authoriser.
 */
export async function issuedPdfInput(
  db: Knex,
  record: CaseRecord,
  parts: IssuedParts,
): Promise<ReportPdfInput> {
  const common = await caseParts(db, record)
  const issued = parts.issuedAt.toISOString().slice(0, 10)
  return {
    ...common,
    report: {
      number: reportNumberOf(record.number),
      revision: parts.revision,
      issuedAt: parts.issuedAt.toISOString(),
      replaces: parts.replaces,
      draft: false,
    },
    dates: { ...common.dates, issued },
    people: {
      author: await person(db, record.leadInvestigatorId, 'Lead investigator'),
      reviewer: await person(db, parts.approverId, 'Reviewer (approved the findings)'),
      authoriser: await person(db, parts.issuerId, 'Authorised the issue'),
    },
    doc: parts.doc,
    figures: parts.figures,
    liveBlocks: parts.liveBlocks,
  }
}

/**
 * A draft's PDF input from the case as it is now: the findings draft, live blocks read afresh,
 * figures drawn from the photos' current marks, the observations and the laboratory's settings.
 * An issued revision builds the same input from its frozen copy instead.
 */
export async function draftPdfInput(
  ctx: ServiceContext,
  record: CaseRecord,
  photos: PhotoService,
  now = new Date(),
): Promise<ReportPdfInput> {
  const { db } = ctx
  const row = await findFindings(db, record.id)
  const doc = row ? documentOf(row) : findingsTemplate()
  const figures = figuresOf(doc).map((figure) => figure.attrs)
  const common = await caseParts(db, record)
  return {
    ...common,
    report: {
      number: reportNumberOf(record.number),
      revision: 'draft',
      issuedAt: null,
      replaces: null,
      draft: true,
    },
    dates: { ...common.dates, issued: null },
    people: {
      author: await person(db, record.leadInvestigatorId, 'Lead investigator'),
      reviewer: await person(db, record.reviewerId, 'Reviewer'),
      authoriser: null,
    },
    doc,
    figures: await currentFigures(ctx, record.id, photos, figures),
    liveBlocks: await readLiveBlocks(db, record.id, liveBlockKindsOf(doc), now),
  }
}
