import type { Knex } from 'knex'
import { isStaff } from '../../shared/access/policy'
import { todayIso } from '../../shared/schemas/dates'
import {
  DOCUMENT_MEDIA_TYPES,
  type AttachmentInfo,
  type ServiceEvent,
  type ServiceEventCreate,
  type ServiceEventFields,
  type ServiceEventUpdate,
} from '../../shared/schemas/service-events'
import { AppError, NotFound, ValidationError } from '../errors'
import type { FileStorage } from '../storage/file-storage'
import { displayName } from '../storage/display-name'
import { recogniseType } from '../storage/recognise-type'
import { recordAudit } from './audit'
import type { ServiceContext } from './context'

interface EventRow extends Omit<
  ServiceEvent,
  'attachments' | 'createdAt' | 'updatedAt' | 'hours' | 'cycles' | 'temperatureC' | 'clientVisible'
> {
  hours: number | string | null
  cycles: number | string | null
  temperatureC: number | string | null
  clientVisible: number | boolean
  createdAt: Date
  updatedAt: Date
}

interface AttachmentRow extends Omit<AttachmentInfo, 'createdAt'> {
  caseId: number
  serviceEventId: number | null
  storageKey: string
  createdAt: Date
}

const numberOrNull = (value: number | string | null) => (value === null ? null : Number(value))

function toEvent(row: EventRow, attachments: AttachmentRow[]): ServiceEvent {
  return {
    ...row,
    hours: numberOrNull(row.hours),
    cycles: numberOrNull(row.cycles),
    temperatureC: numberOrNull(row.temperatureC),
    clientVisible: Boolean(row.clientVisible),
    attachments: attachments.map(toAttachmentInfo),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}

function toAttachmentInfo(row: AttachmentRow): AttachmentInfo {
  const { id, fileName, mediaType, size, sha256 } = row
  return { id, fileName, mediaType, size, sha256, createdAt: row.createdAt.toISOString() }
}

/** Events happen on real days up to today: a service history has no future. */
function checkNotFuture(occurredOn: string | undefined, now: Date): void {
  if (occurredOn && occurredOn > todayIso(now)) {
    const message = 'An event in the service history cannot be in the future.'
    throw new ValidationError(message, [{ path: 'occurredOn', message }])
  }
}

export function createServiceEventService(deps: { storage: FileStorage; clock?: () => Date }) {
  const clock = deps.clock ?? (() => new Date())

  async function findRow(db: Knex, caseId: number, eventId: number, forUpdate = false) {
    const query = db('service_events').where({ id: eventId, caseId })
    if (forUpdate) query.forUpdate()
    const row = (await query.first()) as EventRow | undefined
    if (!row) throw new NotFound('No such event in this case.')
    return row
  }

  async function attachmentsOf(db: Knex, eventIds: number[]): Promise<AttachmentRow[]> {
    if (eventIds.length === 0) return []
    return (await db('attachments')
      .whereIn('serviceEventId', eventIds)
      .orderBy('id')) as AttachmentRow[]
  }

  /** The case's timeline in date order; a client sees only the events marked for the client. */
  async function list({ actor, db }: ServiceContext, caseId: number): Promise<ServiceEvent[]> {
    const query = db('service_events').where({ caseId }).orderBy('occurredOn').orderBy('id')
    if (!isStaff(actor)) query.where({ clientVisible: true })
    const rows = (await query) as EventRow[]
    const attachments = await attachmentsOf(
      db,
      rows.map((row) => row.id),
    )
    return rows.map((row) =>
      toEvent(
        row,
        attachments.filter((a) => a.serviceEventId === row.id),
      ),
    )
  }

  async function get(db: Knex, caseId: number, eventId: number): Promise<ServiceEvent> {
    const row = await findRow(db, caseId, eventId)
    return toEvent(row, await attachmentsOf(db, [eventId]))
  }

  async function create({ actor, db }: ServiceContext, caseId: number, input: ServiceEventCreate) {
    checkNotFuture(input.occurredOn, clock())
    const id = await db.transaction(async (trx) => {
      const [newId] = (await trx('service_events').insert({
        ...input,
        caseId,
        createdBy: actor.id,
      })) as number[]
      const details = { eventId: newId, kind: input.kind, occurredOn: input.occurredOn }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'service_event.added', details })
      return newId as number
    })
    return get(db, caseId, id)
  }

  function staleVersion(current: ServiceEvent): AppError {
    return new AppError(
      'version_conflict',
      'Someone else changed this event after you opened it. Nothing was saved.',
      { current },
    )
  }

  async function update(
    { actor, db }: ServiceContext,
    caseId: number,
    eventId: number,
    change: ServiceEventUpdate,
  ): Promise<ServiceEvent> {
    checkNotFuture(change.occurredOn, clock())
    await db.transaction(async (trx) => {
      const row = await findRow(trx, caseId, eventId, true)
      const current = toEvent(row, [])
      if (row.version !== change.version) throw staleVersion(await get(trx, caseId, eventId))
      const { version: _version, ...patch } = change
      const fields = (Object.keys(patch) as (keyof ServiceEventFields)[]).filter(
        (field) => JSON.stringify(current[field]) !== JSON.stringify(patch[field]),
      )
      if (fields.length === 0) return
      const changes = Object.fromEntries(
        fields.map((field) => [field, { from: current[field], to: patch[field] }]),
      )
      const values = Object.fromEntries(fields.map((field) => [field, patch[field]]))
      await trx('service_events')
        .where({ id: eventId })
        .update({ ...values, version: row.version + 1, updatedAt: trx.fn.now() })
      const details = { eventId, changes }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'service_event.changed', details })
    })
    return get(db, caseId, eventId)
  }

  /** Removes the event and its documents' records; the files go once the removal committed. */
  async function remove(
    { actor, db }: ServiceContext,
    caseId: number,
    eventId: number,
    version: number,
  ) {
    const keys = await db.transaction(async (trx) => {
      const row = await findRow(trx, caseId, eventId, true)
      if (row.version !== version) throw staleVersion(await get(trx, caseId, eventId))
      const attachments = await attachmentsOf(trx, [eventId])
      await trx('attachments').where({ serviceEventId: eventId }).delete()
      await trx('service_events').where({ id: eventId }).delete()
      const removed = {
        ...toEvent(row, attachments),
        attachments: attachments.map((a) => a.fileName),
      }
      await recordAudit(trx, {
        caseId,
        actorId: actor.id,
        kind: 'service_event.removed',
        details: { eventId, removed },
      })
      return attachments.map((attachment) => attachment.storageKey)
    })
    await Promise.all(keys.map((key) => deps.storage.remove(key)))
  }

  /** Stores a document for an event: type from the content, bytes kept with their SHA-256. */
  async function attach(
    { actor, db }: ServiceContext,
    caseId: number,
    eventId: number,
    file: { buffer: Buffer; originalname: string },
  ): Promise<AttachmentInfo> {
    await findRow(db, caseId, eventId)
    const mediaType = await recogniseType(file.buffer, DOCUMENT_MEDIA_TYPES)
    const stored = await deps.storage.put(file.buffer)
    try {
      const id = await db.transaction(async (trx) => {
        await findRow(trx, caseId, eventId, true)
        const [newId] = (await trx('attachments').insert({
          caseId,
          serviceEventId: eventId,
          storageKey: stored.key,
          sha256: stored.sha256,
          size: stored.size,
          mediaType,
          fileName: displayName(file.originalname),
          uploadedBy: actor.id,
        })) as number[]
        const details = { eventId, attachmentId: newId, sha256: stored.sha256, size: stored.size }
        await recordAudit(trx, { caseId, actorId: actor.id, kind: 'attachment.added', details })
        return newId as number
      })
      const row = (await db('attachments').where({ id }).first()) as AttachmentRow
      return toAttachmentInfo(row)
    } catch (error) {
      await deps.storage.remove(stored.key)
      throw error
    }
  }

  /** The case an attachment belongs to, for the child-id loader. */
  async function caseOfAttachment(db: Knex, attachmentId: number): Promise<number | undefined> {
    const row = (await db('attachments').where({ id: attachmentId }).first('caseId')) as
      { caseId: number } | undefined
    return row?.caseId
  }

  /** An attachment's bytes for someone who may see its event (clients: client-visible only). */
  async function readAttachment(
    { actor, db }: ServiceContext,
    caseId: number,
    attachmentId: number,
  ) {
    const query = db('attachments')
      .join('service_events', 'service_events.id', 'attachments.serviceEventId')
      .where({ 'attachments.id': attachmentId, 'attachments.caseId': caseId })
      .select('attachments.*')
    if (!isStaff(actor)) query.where('service_events.clientVisible', true)
    const row = (await query.first()) as AttachmentRow | undefined
    if (!row) throw new NotFound()
    const bytes = await deps.storage.read({ key: row.storageKey, sha256: row.sha256 })
    return { info: toAttachmentInfo(row), bytes }
  }

  return { list, get, create, update, remove, attach, caseOfAttachment, readAttachment }
}

export type ServiceEventService = ReturnType<typeof createServiceEventService>
