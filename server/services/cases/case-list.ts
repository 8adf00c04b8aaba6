import type { Knex } from 'knex'
import type { Page } from '../../../shared/api/envelope'
import { isStaff, organisationScope } from '../../../shared/access/policy'
import type {
  CaseListQuery,
  CaseSort,
  CaseSummary,
  ClientCaseView,
} from '../../../shared/schemas/cases'
import { todayIso } from '../../../shared/schemas/dates'
import { statesOfStage, type CaseState } from '../../../shared/workflow/case-states'
import { ValidationError } from '../../errors'
import type { ServiceContext } from '../context'
import { toClientView, toSummary } from './case-record'
import { applySearch, planSearch } from './case-search'
import { wholeScopeKey, type ListTotals } from './list-totals'

/** States in which a case no longer waits on the lab: its due date is met or moot. */
export const FINISHED_STATES: CaseState[] = ['issued', 'closed']

const SORT_COLUMNS: Record<CaseSort, string> = {
  number: 'cases.number',
  title: 'cases.title',
  component: 'cases.component',
  status: 'cases.status',
  turnaround: 'cases.turnaround',
  dueDate: 'cases.dueDate',
  createdAt: 'cases.createdAt',
  updatedAt: 'cases.updatedAt',
}

function applyFilters(cases: Knex.QueryBuilder, query: CaseListQuery, today: string) {
  if (query.organisationId) cases.where('cases.organisationId', query.organisationId)
  if (query.status) cases.where('cases.status', query.status)
  if (query.stage) cases.whereIn('cases.status', statesOfStage(query.stage))
  if (query.safetyCritical !== undefined) cases.where('cases.safetyCritical', query.safetyCritical)
  if (query.material) {
    cases.where('cases.material', 'like', `${query.material.replace(/[\\%_]/g, '\\$&')}%`)
  }
  if (query.overdue) {
    cases.where('cases.dueDate', '<', today).whereNotIn('cases.status', FINISHED_STATES)
  }
  if (query.investigatorId) {
    const person = query.investigatorId
    cases.where((who) =>
      who
        .where('cases.leadInvestigatorId', person)
        .orWhereExists((co) =>
          co
            .select('case_co_investigators.case_id')
            .from('case_co_investigators')
            .where('case_co_investigators.user_id', person)
            .whereRaw('case_co_investigators.case_id = cases.id'),
        ),
    )
  }
  if (query.mechanism) {
    const mechanism = query.mechanism
    cases.whereExists((terms) =>
      terms
        .select('case_terms.case_id')
        .from('case_terms')
        .where({ 'case_terms.kind': 'mechanism', 'case_terms.term': mechanism })
        .whereRaw('case_terms.case_id = cases.id'),
    )
  }
  if (query.q) applySearch(cases, planSearch(query.q))
}

/** The filtered cases in the person's scope, before paging. */
function casesInScope(ctx: ServiceContext, query: CaseListQuery, today: string) {
  const cases = ctx.db('cases')
  const scope = organisationScope(ctx.actor)
  if (scope !== undefined) cases.where('cases.organisationId', scope)
  applyFilters(cases, query, today)
  return cases
}

const STAFF_FILTERS = [
  'status',
  'investigatorId',
  'overdue',
  'safetyCritical',
  'material',
  'mechanism',
] as const

/** Clients filter by their plain stages and search; the working filters are for staff. */
function checkClientFilters(ctx: ServiceContext, query: CaseListQuery): void {
  if (isStaff(ctx.actor)) return
  const used = STAFF_FILTERS.filter((filter) => query[filter] !== undefined)
  if (used.length === 0) return
  const message = 'Filter by stage, or search by number, title, component or your reference.'
  throw new ValidationError(
    message,
    used.map((path) => ({ path, message })),
  )
}

/** What a list row shows (staff summary and client status line), no more. */
const LIST_COLUMNS = [
  'id',
  'number',
  'title',
  'status',
  'turnaround',
  'safetyCritical',
  'organisationId',
  'component',
  'material',
  'clientReference',
  'leadInvestigatorId',
  'dueDate',
  'createdAt',
  'updatedAt',
].map((column) => `cases.${column}`)

/**
 * One page of cases: staff see the working summary, clients their plain status lines.
 *
 * One statement for the page and its total: the page's ids come from `cases` alone in a derived
 * table, so the sort walks an index and stops at the limit; only those rows are joined with
 * their names; the total is a scalar subquery beside them, or the kept total of the person's
 * whole scope (`totals`). A page past the end has no row to carry the total, so only then is it
 * counted on its own.
 */
export async function listCases(
  ctx: ServiceContext,
  query: CaseListQuery,
  now: Date = new Date(),
  totals?: ListTotals,
): Promise<{ data: CaseSummary[] | ClientCaseView[]; page: Page }> {
  checkClientFilters(ctx, query)
  const cases = casesInScope(ctx, query, todayIso(now))
  const totalKey = totals && wholeScopeKey(query, organisationScope(ctx.actor))
  const keptTotal = totalKey === undefined ? undefined : totals?.get(totalKey)
  const sortColumn = SORT_COLUMNS[query.sort]
  const pageIds = cases
    .clone()
    .select('cases.id')
    .orderBy(sortColumn, query.order)
    .orderBy('cases.id', query.order)
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
  const rows = (await ctx.db
    .from(pageIds.as('page'))
    .join('cases', 'cases.id', 'page.id')
    .join('organisations', 'organisations.id', 'cases.organisationId')
    .leftJoin('users as lead', 'lead.id', 'cases.leadInvestigatorId')
    .select(
      ...LIST_COLUMNS,
      'organisations.name as organisationName',
      'lead.name as leadInvestigatorName',
      keptTotal === undefined
        ? cases.clone().count('*').as('listTotal')
        : ctx.db.raw('? AS list_total', [keptTotal]),
    )
    .orderBy(sortColumn, query.order)
    .orderBy('cases.id', query.order)) as (Parameters<typeof toSummary>[0] & {
    clientReference: string | null
    listTotal: number | string
  })[]
  const total = rows[0]
    ? Number(rows[0].listTotal)
    : query.page === 1
      ? 0
      : Number(((await cases.clone().count({ total: '*' })) as [{ total: number }])[0].total)
  if (totalKey !== undefined && keptTotal === undefined) totals?.keep(totalKey, total)
  const page: Page = { number: query.page, size: query.pageSize, total }
  return { data: isStaff(ctx.actor) ? rows.map(toSummary) : rows.map(toClientView), page }
}
