import type { Knex } from 'knex'
import type { HoldCreate, LegalHold } from '../../../shared/schemas/holds'
import { Conflict, NotFound, ValidationError } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'

interface HoldRow extends Omit<LegalHold, 'placedAt' | 'releasedAt'> {
  placedAt: Date
  releasedAt: Date | null
}

const toHold = (row: HoldRow): LegalHold => ({
  id: row.id,
  caseId: row.caseId,
  sampleId: row.sampleId,
  reason: row.reason,
  placedBy: row.placedBy,
  placedAt: row.placedAt.toISOString(),
  releaseReason: row.releaseReason,
  releasedBy: row.releasedBy,
  releasedAt: row.releasedAt?.toISOString() ?? null,
})

async function findHold(db: Knex, caseId: number, holdId: number, forUpdate = false) {
  const query = db('legal_holds').where({ id: holdId, caseId })
  if (forUpdate) query.forUpdate()
  const row = (await query.first()) as HoldRow | undefined
  if (!row) throw new NotFound('No such hold on this case.')
  return row
}

/** Legal holds: placing and releasing are both recorded, and a release keeps its reason. */
export function createHoldService() {
  async function list({ db }: ServiceContext, caseId: number): Promise<LegalHold[]> {
    return ((await db('legal_holds').where({ caseId }).orderBy('id')) as HoldRow[]).map(toHold)
  }

  async function place({ actor, db }: ServiceContext, caseId: number, input: HoldCreate) {
    const id = await db.transaction(async (trx) => {
      if (input.sampleId !== null) {
        const sample = await trx('samples').where({ id: input.sampleId, caseId }).first('id')
        if (!sample) {
          const message = 'Choose an item of this case.'
          throw new ValidationError(message, [{ path: 'sampleId', message }])
        }
      }
      const [holdId] = (await trx('legal_holds').insert({
        ...input,
        caseId,
        placedBy: actor.id,
      })) as number[]
      const details = { holdId, sampleId: input.sampleId, reason: input.reason }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'hold.placed', details })
      return holdId as number
    })
    return toHold(await findHold(db, caseId, id))
  }

  async function release(
    { actor, db }: ServiceContext,
    caseId: number,
    holdId: number,
    reason: string,
  ) {
    await db.transaction(async (trx) => {
      const row = await findHold(trx, caseId, holdId, true)
      if (row.releasedAt !== null) throw new Conflict('That hold was released already.')
      await trx('legal_holds')
        .where({ id: holdId })
        .update({ releaseReason: reason, releasedBy: actor.id, releasedAt: trx.fn.now(3) })
      const details = { holdId, sampleId: row.sampleId, reason }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'hold.released', details })
    })
    return toHold(await findHold(db, caseId, holdId))
  }

  return { list, place, release }
}

export type HoldService = ReturnType<typeof createHoldService>
