import type { Request } from 'express'
import type { Knex } from 'knex'
import type { Page } from '../../shared/api/envelope'
import type {
  SecurityEvent,
  SecurityEventKind,
  SecurityEventQuery,
} from '../../shared/schemas/security-events'

/** Who did it and from where: the client address (as the trusted proxies tell it) and agent. */
export interface SecurityContext {
  actorId: number | null
  address: string | null
  userAgent: string | null
}

export interface SecurityEventInput {
  kind: SecurityEventKind
  /** the address the event concerns, when it is not simply the actor's */
  email?: string | null
  details?: Record<string, unknown>
}

export function securityContextOf(req: Request): SecurityContext {
  return {
    actorId: req.user?.id ?? null,
    address: req.ip ?? null,
    userAgent: req.get('user-agent')?.slice(0, 512) ?? null,
  }
}

/** Writes one row of the append-only security trail (in the caller's transaction, if any). */
export async function recordSecurityEvent(
  db: Knex,
  context: SecurityContext,
  event: SecurityEventInput,
): Promise<void> {
  await db('security_events').insert({
    kind: event.kind,
    actorId: context.actorId,
    email: event.email ?? null,
    address: context.address,
    userAgent: context.userAgent,
    details: event.details ? JSON.stringify(event.details) : null,
  })
}

interface SecurityEventRow extends Omit<SecurityEvent, 'at' | 'details' | 'email'> {
  at: Date
  email: string | null
  actorEmail: string | null
  details: string | Record<string, unknown> | null
}

/** One page of the trail, newest first, optionally of one kind. */
export async function listSecurityEvents(
  db: Knex,
  query: SecurityEventQuery,
): Promise<{ data: SecurityEvent[]; page: Page }> {
  const events = db('security_events')
  if (query.kind) events.where('security_events.kind', query.kind)
  const [{ total }] = (await events.clone().count({ total: '*' })) as [{ total: number }]
  const rows = (await events
    .clone()
    .leftJoin('users', 'users.id', 'security_events.actorId')
    .select('security_events.*', 'users.email as actorEmail')
    .orderBy('security_events.id', 'desc')
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)) as SecurityEventRow[]
  const page: Page = { number: query.page, size: query.pageSize, total: Number(total) }
  return { data: rows.map(toSecurityEvent), page }
}

function toSecurityEvent(row: SecurityEventRow): SecurityEvent {
  const details = typeof row.details === 'string' ? JSON.parse(row.details) : row.details
  return {
    id: Number(row.id),
    kind: row.kind,
    actorId: row.actorId,
    email: row.email ?? row.actorEmail,
    address: row.address,
    userAgent: row.userAgent,
    details: details as Record<string, unknown> | null,
    at: row.at.toISOString(),
  }
}
