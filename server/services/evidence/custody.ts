import type { Knex } from 'knex'
import { HELD_KINDS, type CustodyEventCreate } from '../../../shared/schemas/samples'
import { Conflict, ValidationError } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { refuseUnderHold, requireNotice } from './guards'
import { findSample, lineageOf } from './sample-rows'

/** A little allowance for clocks that disagree between the browser and the server. */
const CLOCK_SKEW_MS = 5 * 60 * 1000

function refuse(path: string, message: string): never {
  throw new ValidationError(message, [{ path, message }])
}

async function checkCorrection(trx: Knex, sampleId: number, corrects: number | null) {
  if (corrects === null) return
  const target = (await trx('custody_events').where({ id: corrects, sampleId }).first('id')) as
    { id: number } | undefined
  if (!target) refuse('corrects', 'Name an event of this item’s history.')
  const already = await trx('custody_events').where({ correctsId: corrects }).first('id')
  if (already) throw new Conflict('That event was corrected already: correct the correction.')
}

export function createCustodyService(deps: { clock?: () => Date } = {}) {
  const clock = deps.clock ?? (() => new Date())

  /**
   * Appends an event to an item's chain of custody (ASTM E1188). Events are never changed or
   * removed; a correction is a new event naming the one it corrects. A move under a legal hold
   * is refused, and sectioning needs a notice that allows it (ASTM E860).
   */
  async function add(
    { actor, db }: ServiceContext,
    caseId: number,
    sampleId: number,
    input: CustodyEventCreate,
  ): Promise<number> {
    const now = clock()
    if (Date.parse(input.at) > now.getTime() + CLOCK_SKEW_MS) {
      refuse('at', 'A custody event cannot be in the future.')
    }
    return db.transaction(async (trx) => {
      const sample = await findSample(trx, caseId, sampleId, true)
      const lineage = await lineageOf(trx, sample)
      if (HELD_KINDS.includes(input.kind)) {
        await refuseUnderHold(trx, caseId, lineage, sample.itemId)
      }
      if (input.kind === 'sectioned') {
        await requireNotice(trx, caseId, lineage, sample.itemId, now)
      }
      await checkCorrection(trx, sampleId, input.corrects)
      const { from, to, corrects, at, ...rest } = input
      const [id] = (await trx('custody_events').insert({
        ...rest,
        caseId,
        sampleId,
        fromParty: from,
        toParty: to,
        at: new Date(at),
        correctsId: corrects,
        enteredBy: actor.id,
      })) as number[]
      if (input.location !== null) {
        await trx('samples')
          .where({ id: sampleId })
          .update({ storageLocation: input.location, updatedAt: trx.fn.now() })
      }
      const details = { sampleId, itemId: sample.itemId, eventId: id, kind: input.kind, from, to }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'custody_event.added', details })
      return id as number
    })
  }

  return { add }
}

export type CustodyService = ReturnType<typeof createCustodyService>
