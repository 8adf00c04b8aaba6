import type { Knex } from 'knex'
import type { CaseCreate, CaseDetail, CaseListQuery, CaseSummary } from '../../shared/schemas/cases'
import type { Page } from '../../shared/schemas/common'
import type { Role } from '../../shared/schemas/roles'
import { checkTransition, type CaseState } from '../../shared/workflow/case-states'
import { Conflict, Forbidden, NotFound, ValidationError } from '../errors'
import { recordAudit } from './audit'

interface CaseRow extends Omit<CaseDetail, 'createdAt' | 'updatedAt' | 'dueDate' | 'failureDate'> {
  createdAt: Date
  updatedAt: Date
  dueDate: Date | null
  failureDate: Date | null
}

const isoDay = (value: Date | null) => (value ? value.toISOString().slice(0, 10) : null)

function toDetail(row: CaseRow): CaseDetail {
  return {
    ...row,
    dueDate: isoDay(row.dueDate),
    failureDate: isoDay(row.failureDate),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}

function toSummary(row: CaseRow): CaseSummary {
  const { partNumber: _partNumber, failureDate: _failureDate, ...summary } = toDetail(row)
  return summary
}

export function formatCaseNumber(year: number, sequence: number): string {
  return `FL-${year}-${String(sequence).padStart(4, '0')}`
}

function baseQuery(db: Knex) {
  return db('cases')
    .join('organisations', 'organisations.id', 'cases.organisationId')
    .leftJoin('users as lead', 'lead.id', 'cases.leadInvestigatorId')
    .select(
      'cases.*',
      'organisations.name as organisationName',
      'lead.name as leadInvestigatorName',
    )
}

/** Next number of the year, serialised by the counter row's lock until the transaction ends. */
async function nextCaseNumber(trx: Knex.Transaction, year: number): Promise<string> {
  await trx.raw(
    'INSERT INTO case_number_counters (year, last_value) VALUES (?, 1) ON DUPLICATE KEY UPDATE last_value = last_value + 1',
    [year],
  )
  const row = (await trx('case_number_counters').where({ year }).first('lastValue')) as {
    lastValue: number
  }
  return formatCaseNumber(year, row.lastValue)
}

async function checkReferences(trx: Knex, input: CaseCreate): Promise<void> {
  const organisation = await trx('organisations')
    .where({ id: input.organisationId })
    .first('active')
  if (!organisation?.active) {
    throw new ValidationError('Choose an active client organisation.', [
      { path: 'organisationId', message: 'Choose an active client organisation.' },
    ])
  }
  if (input.leadInvestigatorId === null) return
  const lead = await trx('users')
    .join('user_roles', 'user_roles.userId', 'users.id')
    .where({
      'users.id': input.leadInvestigatorId,
      'users.active': true,
      'user_roles.role': 'investigator',
    })
    .first('users.id')
  if (!lead) {
    throw new ValidationError('The lead investigator must be an active investigator.', [
      { path: 'leadInvestigatorId', message: 'Choose an active investigator.' },
    ])
  }
}

export function createCaseService(db: Knex, clock: () => Date = () => new Date()) {
  async function list(query: CaseListQuery, organisationScope?: number) {
    const filtered = db('cases')
    if (organisationScope !== undefined) filtered.where('cases.organisationId', organisationScope)
    if (query.organisationId) filtered.where('cases.organisationId', query.organisationId)
    if (query.status) filtered.where('cases.status', query.status)
    if (query.q) {
      const like = `%${query.q.replace(/[\\%_]/g, (char) => `\\${char}`)}%`
      filtered.where((where) =>
        ['number', 'title', 'component', 'material'].forEach((column) =>
          where.orWhere(`cases.${column}`, 'like', like),
        ),
      )
    }
    const [{ total }] = (await filtered.clone().count({ total: '*' })) as [{ total: number }]
    const rows = (await baseQuery(db)
      .whereIn('cases.id', filtered.clone().select('cases.id'))
      .orderBy('cases.createdAt', 'desc')
      .orderBy('cases.id', 'desc')
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize)) as CaseRow[]
    const page: Page = { number: query.page, size: query.pageSize, total: Number(total) }
    return { data: rows.map(toSummary), page }
  }

  /** A case out of the person's scope answers exactly like a missing one. */
  async function get(id: number, organisationScope?: number): Promise<CaseDetail> {
    const query = baseQuery(db).where('cases.id', id)
    if (organisationScope !== undefined) query.where('cases.organisationId', organisationScope)
    const row = (await query.first()) as CaseRow | undefined
    if (!row) throw new NotFound('No such case.')
    return toDetail(row)
  }

  async function create(input: CaseCreate, actorId: number): Promise<CaseDetail> {
    const id = await db.transaction(async (trx) => {
      await checkReferences(trx, input)
      const number = await nextCaseNumber(trx, clock().getUTCFullYear())
      const [newId] = (await trx('cases').insert({
        ...input,
        number,
        status: 'intake',
        createdBy: actorId,
      })) as number[]
      await recordAudit(trx, {
        caseId: newId,
        actorId,
        action: 'case.created',
        details: { number },
      })
      return newId as number
    })
    return get(id)
  }

  async function changeStatus(id: number, to: CaseState, actor: { id: number; roles: Role[] }) {
    await db.transaction(async (trx) => {
      const current = (await trx('cases').where({ id }).forUpdate().first('status')) as
        { status: CaseState } | undefined
      if (!current) throw new NotFound('No such case.')
      const check = checkTransition(current.status, to, actor.roles, 'direct')
      if (!check.allowed && check.reason === 'role') {
        throw new Forbidden('Your role cannot make this change.')
      }
      if (!check.allowed) {
        throw new Conflict(`A case cannot go from ${current.status} to ${to} this way.`)
      }
      await trx('cases').where({ id }).update({ status: to, updatedAt: trx.fn.now() })
      await recordAudit(trx, {
        caseId: id,
        actorId: actor.id,
        action: 'case.status_changed',
        details: { from: current.status, to },
      })
    })
    return get(id)
  }

  return { list, get, create, changeStatus }
}

export type CaseService = ReturnType<typeof createCaseService>
