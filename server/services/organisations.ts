import type { Knex } from 'knex'
import type {
  Organisation,
  OrganisationCreate,
  OrganisationUpdate,
} from '../../shared/schemas/organisations'
import { withDbErrors } from '../db/errors'
import { NotFound } from '../errors'
import { recordAudit } from './audit'
import { recordSecurityEvent, type SecurityContext } from './security-events'

interface OrganisationRow extends Omit<
  Organisation,
  'active' | 'createdAt' | 'requiresSecondFactor'
> {
  active: number | boolean
  requiresSecondFactor: number | boolean
  createdAt: Date
}

const DUPLICATE_NAME = 'An organisation with this name already exists.'

const toOrganisation = (row: OrganisationRow): Organisation => ({
  id: row.id,
  name: row.name,
  contactName: row.contactName,
  contactEmail: row.contactEmail,
  active: Boolean(row.active),
  requiresSecondFactor: Boolean(row.requiresSecondFactor),
  createdAt: row.createdAt.toISOString(),
})

export function createOrganisationService(db: Knex) {
  /** All organisations, or only the one a client belongs to. */
  async function list(onlyId?: number): Promise<Organisation[]> {
    const query = db('organisations').orderBy('name')
    if (onlyId !== undefined) query.where({ id: onlyId })
    return ((await query) as OrganisationRow[]).map(toOrganisation)
  }

  async function get(id: number): Promise<Organisation> {
    const row = (await db('organisations').where({ id }).first()) as OrganisationRow | undefined
    if (!row) throw new NotFound('No such organisation.')
    return toOrganisation(row)
  }

  async function create(input: OrganisationCreate, actorId: number): Promise<Organisation> {
    const id = await withDbErrors(
      () =>
        db.transaction(async (trx) => {
          const [newId] = (await trx('organisations').insert(input)) as number[]
          await recordAudit(trx, {
            actorId,
            kind: 'organisation.created',
            details: { organisationId: newId },
          })
          return newId as number
        }),
      DUPLICATE_NAME,
    )
    return get(id)
  }

  async function update(
    id: number,
    input: OrganisationUpdate,
    actorId: number,
    trail: SecurityContext = { actorId, address: null, userAgent: null },
  ) {
    const before = await get(id)
    await withDbErrors(
      () =>
        db.transaction(async (trx) => {
          await trx('organisations').where({ id }).update(input)
          await recordAudit(trx, {
            actorId,
            kind: 'organisation.updated',
            details: { organisationId: id },
          })
          if (before.requiresSecondFactor !== input.requiresSecondFactor) {
            const details = {
              organisationId: id,
              from: before.requiresSecondFactor,
              to: input.requiresSecondFactor,
            }
            const kind = 'organisation.second_factor_changed'
            await recordSecurityEvent(trx, trail, { kind, details })
          }
        }),
      DUPLICATE_NAME,
    )
    return get(id)
  }

  return { list, get, create, update }
}

export type OrganisationService = ReturnType<typeof createOrganisationService>
