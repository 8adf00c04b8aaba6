import type { Knex } from 'knex'
import { canonicalJson } from '../../../shared/findings/canonical-json'
import type { ReportSummary } from '../../../shared/schemas/reports'
import { sha256Hex } from '../review/content-hash'

/** An issued revision as stored (immutable once `rowSha256` is written). */
export interface ReportRow {
  id: number
  caseId: number
  number: string
  revision: string
  replacesReportId: number | null
  amendmentReason: string | null
  doc: string
  html: string
  liveBlocks: string
  contentSha256: string
  approvedBy: number
  approvedAt: Date
  issuedBy: number
  issuedAt: Date
  rowSha256: string
}

export interface FigureRow {
  figureId: string
  photoId: number
  storageKey: string
  sha256: string
  size: number
}

export async function findReportRow(db: Knex, reportId: number): Promise<ReportRow | undefined> {
  return (await db('reports').where({ id: reportId }).first()) as ReportRow | undefined
}

export async function figureRowsOf(db: Knex, reportId: number): Promise<FigureRow[]> {
  return (await db('report_figures')
    .where({ reportId })
    .orderBy('figureId')
    .select('figureId', 'photoId', 'storageKey', 'sha256', 'size')) as FigureRow[]
}

/**
 * SHA-256 of the whole stored revision: every column but the hash itself, and its figures' files
 * (by key and hash). A change to any of them, even straight in the database, changes this.
 */
export function rowHashOf(row: ReportRow, figures: FigureRow[]): string {
  const { rowSha256: _hash, approvedAt, issuedAt, ...columns } = row
  const sealed = {
    ...columns,
    approvedAt: approvedAt.toISOString(),
    issuedAt: issuedAt.toISOString(),
    figures: [...figures].sort((a, b) => (a.figureId < b.figureId ? -1 : 1)),
  }
  return sha256Hex(canonicalJson(sealed))
}

export const caseOfReport = async (db: Knex, reportId: number) =>
  ((await db('reports').where({ id: reportId }).first('caseId')) as { caseId: number } | undefined)
    ?.caseId

interface SummaryRow {
  id: number
  caseId: number
  number: string
  revision: string
  issuedAt: Date
  issuedByName: string
  approvedAt: Date
  approvedByName: string
  replacesReportId: number | null
  amendmentReason: string | null
  contentSha256: string
  acknowledgedAt: Date | null
}

/** The case's revisions, newest first, each knowing the one it replaces and the one after it. */
export async function reportSummaries(
  db: Knex,
  caseId: number,
  viewerId: number,
): Promise<ReportSummary[]> {
  return summariesOf(await summaryRows(db, viewerId).where('r.caseId', caseId))
}

/**
 * Every revision the person may read (a client: their organisation's), newest first, with the
 * case each belongs to: the reading room's list.
 */
export async function readableReports(
  db: Knex,
  viewerId: number,
  organisationId: number | undefined,
): Promise<(ReportSummary & { caseNumber: string; caseTitle: string })[]> {
  const query = summaryRows(db, viewerId)
    .join('cases', 'cases.id', 'r.caseId')
    .select('cases.number as caseNumber', 'cases.title as caseTitle')
    .limit(500)
  if (organisationId !== undefined) query.where('cases.organisationId', organisationId)
  const rows = (await query) as (SummaryRow & { caseNumber: string; caseTitle: string })[]
  const byCase = new Map<number, typeof rows>()
  for (const row of rows) byCase.set(row.caseId, [...(byCase.get(row.caseId) ?? []), row])
  const titles = new Map(rows.map((row) => [row.id, row]))
  return [...byCase.values()]
    .flatMap((caseRows) => summariesOf(caseRows))
    .map((summary) => ({
      ...summary,
      caseNumber: titles.get(summary.id)?.caseNumber ?? '',
      caseTitle: titles.get(summary.id)?.caseTitle ?? '',
    }))
    .sort((a, b) => b.id - a.id)
}

function summaryRows(db: Knex, viewerId: number) {
  return db('reports as r')
    .join('users as i', 'i.id', 'r.issuedBy')
    .join('users as a', 'a.id', 'r.approvedBy')
    .leftJoin('report_acknowledgements as k', (join) =>
      join.on('k.reportId', 'r.id').andOnVal('k.personId', viewerId),
    )
    .orderBy('r.id', 'desc')
    .select(
      'r.id',
      'r.caseId',
      'r.number',
      'r.revision',
      'r.issuedAt',
      'r.approvedAt',
      'r.replacesReportId',
      'r.amendmentReason',
      'r.contentSha256',
      'i.name as issuedByName',
      'a.name as approvedByName',
      'k.acknowledgedAt',
    )
}

/** Summaries of one case's rows, newest first. */
function summariesOf(rows: SummaryRow[]): ReportSummary[] {
  const revisionOf = new Map(rows.map((row) => [row.id, row.revision]))
  return rows.map((row, index) => {
    const next = index > 0 ? rows[index - 1] : undefined
    const replaces = row.replacesReportId
    return {
      id: row.id,
      caseId: row.caseId,
      number: row.number,
      revision: row.revision,
      issuedAt: row.issuedAt.toISOString(),
      issuedByName: row.issuedByName,
      approvedAt: row.approvedAt.toISOString(),
      approvedByName: row.approvedByName,
      replaces: replaces ? { id: replaces, revision: revisionOf.get(replaces) ?? '?' } : null,
      amendmentReason: row.amendmentReason,
      supersededBy: next ? { id: next.id, revision: next.revision } : null,
      contentSha256: row.contentSha256,
      acknowledgedAt: row.acknowledgedAt?.toISOString() ?? null,
    }
  })
}
