import type { Knex } from 'knex'
import { isStaff } from '../../../shared/access/policy'
import { custodyFlags, effectiveChain } from '../../../shared/evidence/custody-flags'
import { todayIso } from '../../../shared/schemas/dates'
import type {
  ClientSample,
  Sample,
  SampleCreate,
  SampleDetail,
} from '../../../shared/schemas/samples'
import { NotFound, ValidationError } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { activeHoldIds, refuseUnderHold, requireNotice } from './guards'
import { eventsOf, findSample, lineageOf, toSample, type SampleRow } from './sample-rows'

/** What a client sees of an item marked for them: an explicit list of fields. */
function toClientSample(sample: Sample): ClientSample {
  const { id, caseId, itemId, parentId, description, receivedOn, condition } = sample
  return { id, caseId, itemId, parentId, description, receivedOn, condition }
}

function checkNotFuture(receivedOn: string, now: Date): void {
  if (receivedOn <= todayIso(now)) return
  const message = 'An item cannot be received in the future.'
  throw new ValidationError(message, [{ path: 'receivedOn', message }])
}

async function nextPosition(trx: Knex, caseId: number, parentId: number | null) {
  const query = trx('samples').where({ caseId })
  if (parentId === null) query.whereNull('parentId')
  else query.where({ parentId })
  const row = (await query.max({ last: 'position' }).first()) as { last: number | null }
  return (row.last ?? 0) + 1
}

async function nameOf(trx: Knex, userId: number): Promise<string> {
  const row = (await trx('users').where({ id: userId }).first('name')) as { name: string }
  return row.name
}

export function createSampleService(deps: { clock?: () => Date } = {}) {
  const clock = deps.clock ?? (() => new Date())

  /** The case's items in the order they were registered; a client only those marked for them. */
  async function list({ actor, db }: ServiceContext, caseId: number) {
    const query = db('samples').where({ caseId }).orderBy('id')
    if (!isStaff(actor)) query.where({ clientVisible: true })
    const samples = ((await query) as SampleRow[]).map(toSample)
    return isStaff(actor) ? samples : samples.map(toClientSample)
  }

  /** One item with its whole custody history and what it warns about. */
  async function get({ actor, db }: ServiceContext, caseId: number, sampleId: number) {
    const row = await findSample(db, caseId, sampleId)
    const sample = toSample(row)
    if (!isStaff(actor)) {
      if (!sample.clientVisible) throw new NotFound('No such item in this case.')
      return toClientSample(sample)
    }
    const events = await eventsOf(db, sampleId)
    const holdIds = await activeHoldIds(db, caseId, await lineageOf(db, row))
    const detail: SampleDetail = {
      ...sample,
      events,
      flags: custodyFlags(events, sample.storageLocation),
      holdIds,
    }
    return detail
  }

  /** A registered item: a new one receives a `received` event, a piece cut from one `sectioned`. */
  async function create(
    { actor, db }: ServiceContext,
    caseRef: { id: number; number: string },
    input: SampleCreate,
  ): Promise<Sample> {
    checkNotFuture(input.receivedOn, clock())
    const id = await db.transaction(async (trx) => {
      // one writer at a time per case, so item ids are handed out once
      await trx('cases').where({ id: caseRef.id }).forUpdate().first('id')
      const parent = input.parentId ? await findParent(trx, caseRef.id, input.parentId) : null
      if (parent) {
        const lineage = await lineageOf(trx, parent)
        await refuseUnderHold(trx, caseRef.id, lineage, parent.itemId)
        await requireNotice(trx, caseRef.id, lineage, parent.itemId, clock())
      }
      const position = await nextPosition(trx, caseRef.id, parent?.id ?? null)
      const itemId = parent ? `${parent.itemId}.${position}` : `${caseRef.number}-S${position}`
      const [newId] = (await trx('samples').insert({
        ...input,
        storageLocation: input.storageLocation ?? parent?.storageLocation ?? null,
        caseId: caseRef.id,
        position,
        itemId,
        createdBy: actor.id,
      })) as number[]
      const custodian = await nameOf(trx, actor.id)
      if (parent) await recordCut(trx, actor.id, parent, newId as number, itemId, input)
      else await recordReceipt(trx, actor.id, newId as number, caseRef.id, input, custodian)
      const kind = parent ? 'sample.sectioned' : 'sample.received'
      const details = { sampleId: newId, itemId, parentId: parent?.id ?? null }
      await recordAudit(trx, { caseId: caseRef.id, actorId: actor.id, kind, details })
      return newId as number
    })
    return toSample(await findSample(db, caseRef.id, id))
  }

  async function findParent(trx: Knex, caseId: number, parentId: number) {
    try {
      return await findSample(trx, caseId, parentId, true)
    } catch {
      const message = 'Choose the item the piece was cut from.'
      throw new ValidationError(message, [{ path: 'parentId', message }])
    }
  }

  async function recordReceipt(
    trx: Knex,
    actorId: number,
    sampleId: number,
    caseId: number,
    input: SampleCreate,
    custodian: string,
  ) {
    await trx('custody_events').insert({
      caseId,
      sampleId,
      kind: 'received',
      fromParty: input.receivedFrom,
      toParty: custodian,
      at: new Date(`${input.receivedOn}T00:00:00Z`),
      condition: input.condition,
      location: input.storageLocation,
      enteredBy: actorId,
    })
  }

  /** The cut shows in both histories; the custodian does not change, so no gap appears. */
  async function recordCut(
    trx: Knex,
    actorId: number,
    parent: SampleRow,
    pieceId: number,
    itemId: string,
    input: SampleCreate,
  ) {
    const chain = effectiveChain(await eventsOf(trx, parent.id))
    const custodian = chain.at(-1)?.to ?? (await nameOf(trx, actorId))
    // to the minute, as people enter times: an event entered in the same minute sorts after it
    const at = new Date(Math.floor(clock().getTime() / 60_000) * 60_000)
    const cut = [input.cutLocation, input.orientation].filter(Boolean).join(', ')
    const common = { caseId: parent.caseId, kind: 'sectioned', fromParty: custodian, at }
    await trx('custody_events').insert([
      {
        ...common,
        sampleId: parent.id,
        toParty: custodian,
        purpose: `Cut ${itemId}${cut ? ` (${cut})` : ''}`,
        enteredBy: actorId,
      },
      {
        ...common,
        sampleId: pieceId,
        toParty: custodian,
        purpose: `Cut from ${parent.itemId}${cut ? ` (${cut})` : ''}`,
        condition: input.condition,
        location: input.storageLocation ?? parent.storageLocation,
        enteredBy: actorId,
      },
    ])
  }

  return { list, get, create }
}

export type SampleService = ReturnType<typeof createSampleService>
