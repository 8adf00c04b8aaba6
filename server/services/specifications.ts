import type { Knex } from 'knex'
import type {
  Specification,
  SpecificationBand,
  SpecificationCreate,
  SpecificationUpdate,
} from '../../shared/schemas/specifications'
import { STARTER_SPECIFICATIONS, type SpecificationRecord } from '../../shared/tensile'
import { AppError, Conflict, NotFound } from '../errors'
import type { ServiceContext } from './context'

interface SpecificationRow extends Omit<
  Specification,
  'bands' | 'unverified' | 'checkedAt' | 'edition'
> {
  edition: string | null
  bands: string | SpecificationBand[]
  unverified: number | boolean
  checkedAt: Date | null
}

function toSpecification(row: SpecificationRow): Specification {
  const {
    createdAt: _c,
    updatedAt: _u,
    ...rest
  } = row as SpecificationRow & {
    createdAt?: Date
    updatedAt?: Date
  }
  return {
    ...rest,
    bands:
      typeof row.bands === 'string' ? (JSON.parse(row.bands) as SpecificationBand[]) : row.bands,
    unverified: Boolean(row.unverified),
    checkedAt: row.checkedAt ? row.checkedAt.toISOString() : null,
  }
}

/** The engine's starter record as a library record with one size band, in MPa. */
export function starterAsLibraryRecord(record: SpecificationRecord): SpecificationCreate {
  const band: SpecificationBand = {
    overMm: record.thicknessBandMm?.over ?? null,
    upToMm: record.thicknessBandMm?.upTo ?? null,
    yield: record.yield ? { min: record.yield.minMPa, kind: record.yield.kind } : null,
    tensileStrength: { min: record.tensileStrength.minMPa, max: record.tensileStrength.maxMPa },
    elongation: record.elongation.map((e) => ({ minPct: e.minPct, basis: { ...e.basis } })),
    reductionOfAreaMinPct: record.reductionOfAreaMinPct,
    hardness: record.hardness,
  }
  return {
    designation: record.designation,
    standard: record.standard,
    edition: record.edition,
    grade: record.grade,
    productForm: record.productForm,
    units: 'MPa',
    bands: [band],
    source: record.source,
  }
}

/**
 * Puts the engine's starter records into an empty library, each marked unverified until an
 * administrator records a check against the edition. Does nothing once the library has records.
 */
export async function seedStarterSpecifications(db: Knex): Promise<number> {
  const row = (await db('specifications').count({ n: '*' }).first()) as { n: number | string }
  if (Number(row.n) > 0) return 0
  const rows = STARTER_SPECIFICATIONS.map((record) => {
    const value = starterAsLibraryRecord(record)
    return { ...value, bands: JSON.stringify(value.bands), unverified: true }
  })
  await db('specifications').insert(rows)
  return rows.length
}

async function findRow(db: Knex, id: number, forUpdate = false): Promise<SpecificationRow> {
  const query = db('specifications').where({ id })
  if (forUpdate) query.forUpdate()
  const row = (await query.first()) as SpecificationRow | undefined
  if (!row) throw new NotFound('No such specification record.')
  return row
}

async function checkUniqueDesignation(db: Knex, designation: string, exceptId?: number) {
  const query = db('specifications').where({ designation })
  if (exceptId !== undefined) query.whereNot({ id: exceptId })
  if (await query.first('id'))
    throw new Conflict(`The library already has a record named ${designation}.`)
}

export async function listSpecifications(db: Knex): Promise<Specification[]> {
  const rows = (await db('specifications').orderBy('designation')) as SpecificationRow[]
  return rows.map(toSpecification)
}

export async function getSpecification(db: Knex, id: number): Promise<Specification> {
  return toSpecification(await findRow(db, id))
}

/** An administrator's new record: checked by them, so not marked unverified. */
export async function createSpecification(
  { actor, db }: ServiceContext,
  input: SpecificationCreate,
) {
  await checkUniqueDesignation(db, input.designation)
  const [id] = (await db('specifications').insert({
    ...input,
    bands: JSON.stringify(input.bands),
    unverified: false,
    checkedAgainstEdition: input.edition,
    checkedBy: actor.id,
    checkedAt: db.fn.now(),
  })) as number[]
  return getSpecification(db, id as number)
}

/**
 * Changes a record; naming `checkedAgainstEdition` records that the administrator checked every
 * limit against that edition, which lifts the unverified mark.
 */
export async function updateSpecification(
  { actor, db }: ServiceContext,
  id: number,
  change: SpecificationUpdate,
): Promise<Specification> {
  await db.transaction(async (trx) => {
    const row = await findRow(trx, id, true)
    if (row.version !== change.version)
      throw new AppError(
        'version_conflict',
        'Someone else changed this specification record after you opened it. Nothing was saved.',
        { current: toSpecification(row) },
      )
    const { version: _version, checkedAgainstEdition, bands, ...fields } = change
    if (fields.designation) await checkUniqueDesignation(trx, fields.designation, id)
    const checked = checkedAgainstEdition
      ? { unverified: false, checkedAgainstEdition, checkedBy: actor.id, checkedAt: trx.fn.now() }
      : {}
    await trx('specifications')
      .where({ id })
      .update({
        ...fields,
        ...(bands ? { bands: JSON.stringify(bands) } : {}),
        ...checked,
        version: row.version + 1,
        updatedAt: trx.fn.now(),
      })
  })
  return getSpecification(db, id)
}
