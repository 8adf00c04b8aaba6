import type { Knex } from 'knex'
import { convertSteelHardness } from '../../shared/hardness/convert'
import type { HardnessScale } from '../../shared/hardness/scales'
import type { HardnessCreate, HardnessSet } from '../../shared/schemas/hardness'
import { NotFound, ValidationError } from '../errors'
import { recordAudit } from './audit'
import type { ServiceContext } from './context'
import { isoDay } from './mechanical-tests/rows'

interface HardnessRow {
  id: number
  caseId: number
  scale: HardnessScale
  readings: string
  load: string | null
  location: string | null
  specimenId: number | null
  sampleId: number | null
  testedOn: string | Date | null
  recordedBy: number
  createdAt: Date
}

function toSet(row: HardnessRow): HardnessSet {
  const values = JSON.parse(row.readings) as number[]
  const mean = Math.round((values.reduce((sum, v) => sum + v, 0) / values.length) * 10) / 10
  return {
    id: row.id,
    caseId: row.caseId,
    scale: row.scale,
    values,
    load: row.load,
    location: row.location,
    specimenId: row.specimenId,
    sampleId: row.sampleId,
    testedOn: isoDay(row.testedOn),
    mean,
    conversion: convertSteelHardness(mean, row.scale),
    recordedBy: row.recordedBy,
    createdAt: row.createdAt.toISOString(),
  }
}

/** A specimen or sample named with a set must belong to the same case. */
async function checkLinks(db: Knex, caseId: number, input: HardnessCreate) {
  for (const [table, id, label] of [
    ['specimens', input.specimenId, 'specimen'],
    ['samples', input.sampleId, 'item'],
  ] as const) {
    if (id === null) continue
    const found = await db(table).where({ id, caseId }).first('id')
    if (!found)
      throw new ValidationError(`Choose a ${label} of this case.`, [
        {
          path: table === 'specimens' ? 'specimenId' : 'sampleId',
          message: `No such ${label} in this case.`,
        },
      ])
  }
}

export async function listHardness({ db }: ServiceContext, caseId: number): Promise<HardnessSet[]> {
  const rows = (await db('hardness_sets').where({ caseId }).orderBy('id')) as HardnessRow[]
  return rows.map(toSet)
}

export async function recordHardness(
  { actor, db }: ServiceContext,
  caseId: number,
  input: HardnessCreate,
): Promise<HardnessSet> {
  const id = await db.transaction(async (trx) => {
    await checkLinks(trx, caseId, input)
    const [newId] = (await trx('hardness_sets').insert({
      caseId,
      scale: input.scale,
      readings: JSON.stringify(input.values),
      load: input.load,
      location: input.location,
      specimenId: input.specimenId,
      sampleId: input.sampleId,
      testedOn: input.testedOn,
      recordedBy: actor.id,
    })) as number[]
    await recordAudit(trx, {
      caseId,
      actorId: actor.id,
      kind: 'hardness.recorded',
      details: { scale: input.scale, values: input.values, location: input.location },
    })
    return newId as number
  })
  const row = (await db('hardness_sets').where({ id }).first()) as HardnessRow | undefined
  if (!row) throw new NotFound()
  return toSet(row)
}
