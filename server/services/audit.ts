import type { Knex } from 'knex'

export interface AuditEntry {
  caseId?: number | null
  actorId: number | null
  /** what happened, e.g. `case.updated`; case kinds are listed in shared/schemas/activity.ts */
  kind: string
  details?: Record<string, unknown>
}

/** Writes one entry of the append-only activity trail, inside the caller's transaction. */
export async function recordAudit(trx: Knex, entry: AuditEntry): Promise<void> {
  await trx('audit_events').insert({
    caseId: entry.caseId ?? null,
    actorId: entry.actorId,
    action: entry.kind,
    details: entry.details ? JSON.stringify(entry.details) : null,
  })
}
