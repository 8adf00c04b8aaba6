import type { Knex } from 'knex'
import {
  observationNumber,
  type Observation,
  type ObservationCreate,
} from '../../../shared/schemas/observations'
import { Conflict, NotFound, ValidationError } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'

interface ObservationRow {
  id: number
  caseId: number
  number: number
  text: string
  recordedBy: number
  recordedByName: string | null
  createdAt: Date
  withdrawReason: string | null
  withdrawnAt: Date | null
}

function refuse(path: string, message: string): never {
  throw new ValidationError(message, [{ path, message }])
}

async function checkLinks(trx: Knex, table: string, caseId: number, ids: number[], path: string) {
  if (ids.length === 0) return
  const found = (await trx(table).where({ caseId }).whereIn('id', ids).count({ n: '*' })) as [
    { n: number },
  ]
  if (Number(found[0].n) !== ids.length)
    refuse(path, `Choose ${path === 'photoIds' ? 'photos' : 'items'} of this case.`)
}

/** An observation cites photos of its own case. */
async function checkPhotos(trx: Knex, caseId: number, photoIds: number[]) {
  await checkLinks(trx, 'photos', caseId, photoIds, 'photoIds')
}

/** The observations register: numbered once per case, never reused, withdrawn but not deleted. */
export function createObservationService() {
  async function load(db: Knex, caseId: number, id?: number): Promise<Observation[]> {
    const query = db('observations')
      .leftJoin('users', 'users.id', 'observations.recordedBy')
      .where('observations.caseId', caseId)
      .select('observations.*', 'users.name as recordedByName')
      .orderBy('observations.number')
    if (id !== undefined) query.where('observations.id', id)
    const rows = (await query) as ObservationRow[]
    const ids = rows.map((row) => row.id)
    const samples = (await db('observation_samples').whereIn('observationId', ids)) as {
      observationId: number
      sampleId: number
    }[]
    const photos = (await db('observation_photos').whereIn('observationId', ids)) as {
      observationId: number
      photoId: number
    }[]
    return rows.map((row) => ({
      id: row.id,
      caseId: row.caseId,
      number: observationNumber(row.number),
      text: row.text,
      sampleIds: samples.filter((l) => l.observationId === row.id).map((l) => l.sampleId),
      photoIds: photos.filter((l) => l.observationId === row.id).map((l) => l.photoId),
      recordedBy: row.recordedBy,
      recordedByName: row.recordedByName,
      createdAt: row.createdAt.toISOString(),
      withdrawn: row.withdrawnAt !== null,
      withdrawReason: row.withdrawReason,
      withdrawnAt: row.withdrawnAt?.toISOString() ?? null,
    }))
  }

  async function one(db: Knex, caseId: number, id: number) {
    const [observation] = await load(db, caseId, id)
    if (!observation) throw new NotFound('No such observation in this case.')
    return observation
  }

  const list = ({ db }: ServiceContext, caseId: number) => load(db, caseId)

  async function create({ actor, db }: ServiceContext, caseId: number, input: ObservationCreate) {
    const sampleIds = [...new Set(input.sampleIds)]
    const photoIds = [...new Set(input.photoIds)]
    const id = await db.transaction(async (trx) => {
      // the case row is the turnstile: one number at a time per case, each used once
      await trx('cases').where({ id: caseId }).forUpdate().first('id')
      await checkLinks(trx, 'samples', caseId, sampleIds, 'sampleIds')
      await checkPhotos(trx, caseId, photoIds)
      const last = (await trx('observations').where({ caseId }).max({ n: 'number' }).first()) as {
        n: number | null
      }
      const number = (last.n ?? 0) + 1
      const [newId] = (await trx('observations').insert({
        caseId,
        number,
        text: input.text,
        recordedBy: actor.id,
      })) as number[]
      const observationId = newId as number
      if (sampleIds.length) {
        await trx('observation_samples').insert(
          sampleIds.map((sampleId) => ({ observationId, sampleId })),
        )
      }
      if (photoIds.length) {
        await trx('observation_photos').insert(
          photoIds.map((photoId) => ({ observationId, photoId })),
        )
      }
      const details = { observationId, number: observationNumber(number) }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'observation.recorded', details })
      return observationId
    })
    return one(db, caseId, id)
  }

  async function withdraw(
    { actor, db }: ServiceContext,
    caseId: number,
    id: number,
    reason: string,
  ) {
    await db.transaction(async (trx) => {
      const row = (await trx('observations').where({ id, caseId }).forUpdate().first()) as
        ObservationRow | undefined
      if (!row) throw new NotFound('No such observation in this case.')
      if (row.withdrawnAt !== null) throw new Conflict('That observation was withdrawn already.')
      await trx('observations')
        .where({ id })
        .update({ withdrawReason: reason, withdrawnBy: actor.id, withdrawnAt: trx.fn.now(3) })
      const details = { observationId: id, number: observationNumber(row.number), reason }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'observation.withdrawn', details })
    })
    return one(db, caseId, id)
  }

  return { list, create, withdraw }
}

export type ObservationService = ReturnType<typeof createObservationService>
