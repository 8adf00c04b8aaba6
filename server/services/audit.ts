import type { Knex } from 'knex'

export interface AuditEntry {
  caseId?: number | null
  actorId: number | null
  action: string
  details?: Record<string, unknown>
}

/** Writes one entry of the activity trail, inside the caller's transaction. */
export async function recordAudit(trx: Knex, entry: AuditEntry): Promise<void> {
  await trx('audit_events').insert({
    caseId: entry.caseId ?? null,
    actorId: entry.actorId,
    action: entry.action,
    details: entry.details ? JSON.stringify(entry.details) : null,
  })
}
