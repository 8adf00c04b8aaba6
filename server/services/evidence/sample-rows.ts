import type { Knex } from 'knex'
import type { CustodyEvent, CutMethod, Sample } from '../../../shared/schemas/samples'
import { NotFound } from '../../errors'

export interface SampleRow extends Omit<Sample, 'clientVisible' | 'createdAt'> {
  position: number
  clientVisible: number | boolean
  createdAt: Date
}

interface EventRow {
  id: number
  sampleId: number
  kind: CustodyEvent['kind']
  fromParty: string
  toParty: string
  at: Date
  purpose: string | null
  condition: string | null
  location: string | null
  correctsId: number | null
  enteredBy: number
  enteredByName: string | null
  createdAt: Date
}

export function toSample(row: SampleRow): Sample {
  return {
    id: row.id,
    caseId: row.caseId,
    itemId: row.itemId,
    parentId: row.parentId,
    description: row.description,
    receivedFrom: row.receivedFrom,
    receivedOn: row.receivedOn,
    collectedBy: row.collectedBy,
    condition: row.condition,
    packaging: row.packaging,
    storageLocation: row.storageLocation,
    cutLocation: row.cutLocation,
    orientation: row.orientation,
    cutMethod: row.cutMethod as CutMethod | null,
    clientVisible: Boolean(row.clientVisible),
    createdAt: row.createdAt.toISOString(),
  }
}

/** The sample of this case, or 404; `forUpdate` serialises changes to one item's custody. */
export async function findSample(
  db: Knex,
  caseId: number,
  sampleId: number,
  forUpdate = false,
): Promise<SampleRow> {
  const query = db('samples').where({ id: sampleId, caseId })
  if (forUpdate) query.forUpdate()
  const row = (await query.first()) as SampleRow | undefined
  if (!row) throw new NotFound('No such item in this case.')
  return row
}

/** The item's id and those of the items it was cut from, nearest first. */
export async function lineageOf(db: Knex, sample: SampleRow): Promise<number[]> {
  const ids = [sample.id]
  let parentId = sample.parentId
  while (parentId !== null) {
    ids.push(parentId)
    const parent = (await db('samples').where({ id: parentId }).first('parentId')) as
      { parentId: number | null } | undefined
    parentId = parent?.parentId ?? null
  }
  return ids
}

export async function eventsOf(db: Knex, sampleId: number): Promise<CustodyEvent[]> {
  const rows = (await db('custody_events')
    .leftJoin('users', 'users.id', 'custody_events.enteredBy')
    .where('custody_events.sampleId', sampleId)
    .select('custody_events.*', 'users.name as enteredByName')
    .orderBy('custody_events.at')
    .orderBy('custody_events.id')) as EventRow[]
  const correctedBy = new Map(
    rows.filter((row) => row.correctsId !== null).map((row) => [row.correctsId, row.id]),
  )
  return rows.map((row) => ({
    id: row.id,
    sampleId: row.sampleId,
    kind: row.kind,
    from: row.fromParty,
    to: row.toParty,
    at: row.at.toISOString(),
    purpose: row.purpose,
    condition: row.condition,
    location: row.location,
    corrects: row.correctsId,
    correctedBy: correctedBy.get(row.id) ?? null,
    enteredBy: row.enteredBy,
    enteredByName: row.enteredByName,
    createdAt: row.createdAt.toISOString(),
  }))
}
