import type { Knex } from 'knex'
import { can, isStaff, organisationScope } from '../../../shared/access/policy'
import type {
  CaseCreate,
  CaseDetail,
  CaseFields,
  CaseListQuery,
  CaseUpdate,
  ClientCaseView,
} from '../../../shared/schemas/cases'
import { checkTransition, nextStates, type CaseState } from '../../../shared/workflow/case-states'
import { AppError, Forbidden } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { findCase, toClientView, toDetail, type CaseRecord } from './case-record'
import { checkCaseRecord } from './case-checks'
import { listCases } from './case-list'
import { createListTotals, LIST_TOTAL_KEEP_MS } from './list-totals'
import { nextCaseNumber } from './case-number'
import { writeCaseTerms } from './case-terms'
import { queueAssignmentNotices } from './assignment-notices'
import {
  caseColumns,
  changedFields,
  fieldsOf,
  kindOfEdit,
  replaceCoInvestigators,
} from './case-writes'

export { formatCaseNumber } from './case-number'
export type { CaseRecord } from './case-record'

export function createCaseService(options: { clock?: () => Date; listTotalKeepMs?: number } = {}) {
  const clock = options.clock ?? (() => new Date())
  const listTotals = createListTotals(options.listTotalKeepMs ?? LIST_TOTAL_KEEP_MS)

  /** The case in the actor's scope: the one loader every case route goes through. */
  function load({ actor, db }: ServiceContext, id: number): Promise<CaseRecord> {
    return findCase(db, id, organisationScope(actor))
  }

  /** The case as this person may see it: the whole record for staff, a status line for clients. */
  async function view(
    ctx: ServiceContext,
    record: CaseRecord,
  ): Promise<CaseDetail | ClientCaseView> {
    if (!isStaff(ctx.actor)) return toClientView(record)
    const allowed = can(ctx.actor, 'case.changeStatus', record)
      ? nextStates(record.status, ctx.actor.roles)
      : []
    return toDetail(ctx.db, record, allowed)
  }

  async function create({ actor, db }: ServiceContext, input: CaseCreate): Promise<CaseRecord> {
    const id = await db.transaction(async (trx) => {
      await checkCaseRecord(
        trx,
        input,
        new Set(Object.keys(input) as (keyof CaseFields)[]),
        clock(),
      )
      const number = await nextCaseNumber(trx, clock().getUTCFullYear())
      const [newId] = (await trx('cases').insert({
        ...caseColumns(input),
        number,
        status: 'intake',
        createdBy: actor.id,
      })) as number[]
      const caseId = newId as number
      await replaceCoInvestigators(trx, caseId, input.coInvestigatorIds)
      await writeCaseTerms(trx, caseId, input)
      await recordAudit(trx, {
        caseId,
        actorId: actor.id,
        kind: 'case.created',
        details: { number },
      })
      await queueAssignmentNotices(trx, caseId, input, actor.id, clock)
      return caseId
    })
    listTotals.forget()
    return findCase(db, id)
  }

  /** Applies a change made against `version`; a stale version changes nothing. */
  async function update(
    ctx: ServiceContext,
    caseId: number,
    change: CaseUpdate,
  ): Promise<CaseRecord> {
    const { actor, db } = ctx
    const updated = await db.transaction(async (trx) => {
      const current = await findCase(trx, caseId, undefined, { forUpdate: true })
      if (current.version !== change.version) {
        throw new AppError(
          'version_conflict',
          'Someone else saved this case after you opened it. Nothing was saved.',
          { current: await view({ actor, db: trx }, current) },
        )
      }
      const { version: _version, ...patch } = change
      const before = fieldsOf(current)
      const after: CaseFields = { ...before, ...patch }
      const changes = changedFields(before, after)
      const fields = Object.keys(changes) as (keyof CaseFields)[]
      if (fields.length === 0) return current
      await checkCaseRecord(trx, after, new Set(fields), clock())
      const columns = caseColumns(Object.fromEntries(fields.map((f) => [f, after[f]])))
      await trx('cases')
        .where({ id: caseId })
        .update({ ...columns, version: current.version + 1, updatedAt: trx.fn.now() })
      if (fields.includes('coInvestigatorIds')) {
        await replaceCoInvestigators(trx, caseId, after.coInvestigatorIds)
      }
      if (
        ['component', 'material', 'mechanisms'].some((f) => fields.includes(f as keyof CaseFields))
      ) {
        await writeCaseTerms(trx, caseId, after)
      }
      await recordAudit(trx, {
        caseId,
        actorId: actor.id,
        kind: kindOfEdit(fields),
        details: { changes },
      })
      const assigned = Object.fromEntries(fields.map((f) => [f, after[f]]))
      await queueAssignmentNotices(trx, caseId, assigned, actor.id, clock)
      return findCase(trx, caseId)
    })
    // a case that moved to another organisation changes two clients' totals
    if (change.organisationId !== undefined) listTotals.forget()
    return updated
  }

  /** A plain status change along the state table (review and issue have their own actions). */
  async function changeStatus(
    { actor, db }: ServiceContext,
    caseId: number,
    to: CaseState,
  ): Promise<CaseRecord> {
    return db.transaction(async (trx) => {
      const current = await findCase(trx, caseId, undefined, { forUpdate: true })
      const check = checkTransition(current.status, to, actor.roles, 'direct')
      if (!check.allowed && check.reason === 'role') {
        throw new Forbidden('Your role cannot make this change.')
      }
      if (!check.allowed) {
        throw new AppError(
          'invalid_transition',
          `A case cannot go from ${current.status} to ${to} this way.`,
          { from: current.status, to },
        )
      }
      await trx('cases')
        .where({ id: caseId })
        .update({ status: to, version: current.version + 1, updatedAt: trx.fn.now() })
      await recordAudit(trx, {
        caseId,
        actorId: actor.id,
        kind: 'case.status_changed',
        details: { from: current.status, to },
      })
      return findCase(trx, caseId)
    })
  }

  function list(ctx: ServiceContext, query: CaseListQuery) {
    return listCases(ctx, query, clock(), listTotals)
  }

  return { load, view, create, update, changeStatus, list }
}

export type CaseService = ReturnType<typeof createCaseService>
export type { Knex }
