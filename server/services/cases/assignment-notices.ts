import type { Knex } from 'knex'
import type { CaseFields } from '../../../shared/schemas/cases'
import type { AssignedPart } from '../notices/notice-kinds'
import { queueNotice } from '../notices/queue-notice'

type PartField = 'leadInvestigatorId' | 'labTechnicianId' | 'reviewerId'

const PART_FIELDS: [AssignedPart, PartField][] = [
  ['lead', 'leadInvestigatorId'],
  ['lab', 'labTechnicianId'],
  ['reviewer', 'reviewerId'],
]

/**
 * Queues "you were assigned" for each part that `fields` gives to someone, in the caller's
 * transaction. Nobody is told of a part they gave themselves.
 */
export async function queueAssignmentNotices(
  trx: Knex,
  caseId: number,
  fields: Partial<CaseFields>,
  actorId: number,
  clock: () => Date,
): Promise<void> {
  for (const [part, field] of PART_FIELDS) {
    const personId = fields[field]
    if (personId === undefined || personId === null || personId === actorId) continue
    await queueNotice(trx, { kind: 'assigned', caseId, personId, part }, clock)
  }
}
