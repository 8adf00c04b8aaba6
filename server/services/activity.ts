import type { Knex } from 'knex'
import type { Page } from '../../shared/api/envelope'
import type { ActivityEntry, ActivityKind, ActivityQuery } from '../../shared/schemas/activity'

interface ActivityRow {
  id: number
  createdAt: Date
  actorId: number | null
  actorName: string | null
  action: ActivityKind
  details: string | Record<string, unknown> | null
}

function toEntry(row: ActivityRow): ActivityEntry {
  const details = typeof row.details === 'string' ? JSON.parse(row.details) : row.details
  return {
    id: Number(row.id),
    at: row.createdAt.toISOString(),
    actorId: row.actorId,
    actorName: row.actorName,
    kind: row.action,
    details: details as Record<string, unknown> | null,
  }
}

/** One page of a case's activity, newest first, optionally by one person or of one kind. */
export async function listActivity(
  db: Knex,
  caseId: number,
  query: ActivityQuery,
): Promise<{ data: ActivityEntry[]; page: Page }> {
  const events = db('audit_events').where('audit_events.caseId', caseId)
  if (query.actorId) events.where('audit_events.actorId', query.actorId)
  if (query.kind) events.where('audit_events.action', query.kind)
  const [{ total }] = (await events.clone().count({ total: '*' })) as [{ total: number }]
  const rows = (await events
    .clone()
    .leftJoin('users', 'users.id', 'audit_events.actorId')
    .select('audit_events.*', 'users.name as actorName')
    .orderBy('audit_events.createdAt', 'desc')
    .orderBy('audit_events.id', 'desc')
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)) as ActivityRow[]
  const page: Page = { number: query.page, size: query.pageSize, total: Number(total) }
  return { data: rows.map(toEntry), page }
}
