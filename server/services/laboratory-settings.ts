import type { Knex } from 'knex'
import type { LaboratorySettings, LaboratorySettingsUpdate } from '../../shared/schemas/laboratory'
import { UNNAMED_LABORATORY } from '../../shared/schemas/laboratory'
import { recordAudit } from './audit'
import type { ServiceContext } from './context'

const ROW_ID = 1

interface Row {
  name: string
  addressLines: string
  updatedAt: Date
}

/** The laboratory's particulars; a placeholder until an administrator has saved them. */
export async function readLaboratorySettings(db: Knex): Promise<LaboratorySettings> {
  const row = (await db('laboratory_settings').where({ id: ROW_ID }).first()) as Row | undefined
  if (!row) return { name: UNNAMED_LABORATORY, addressLines: [], updatedAt: null }
  return {
    name: row.name,
    addressLines: JSON.parse(row.addressLines) as string[],
    updatedAt: row.updatedAt.toISOString(),
  }
}

export async function saveLaboratorySettings(
  { actor, db }: ServiceContext,
  input: LaboratorySettingsUpdate,
): Promise<LaboratorySettings> {
  await db.transaction(async (trx) => {
    const before = await readLaboratorySettings(trx)
    const columns = {
      name: input.name,
      addressLines: JSON.stringify(input.addressLines),
      updatedBy: actor.id,
      updatedAt: trx.fn.now(3),
    }
    await trx('laboratory_settings')
      .insert({ id: ROW_ID, ...columns })
      .onConflict('id')
      .merge(columns)
    await recordAudit(trx, {
      actorId: actor.id,
      kind: 'settings.laboratory_changed',
      details: { from: { name: before.name, addressLines: before.addressLines }, to: input },
    })
  })
  return readLaboratorySettings(db)
}
