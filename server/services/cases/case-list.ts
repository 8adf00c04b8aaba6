import type { Knex } from 'knex'
import type { Page } from '../../../shared/api/envelope'
import { isStaff, organisationScope } from '../../../shared/access/policy'
import type { CaseListQuery, CaseSummary, ClientCaseView } from '../../../shared/schemas/cases'
import { statesOfStage } from '../../../shared/workflow/case-states'
import type { ServiceContext } from '../context'
import { toClientView, toSummary } from './case-record'

const STAFF_SEARCH = ['number', 'title', 'component', 'material', 'clientReference']
const CLIENT_SEARCH = ['number', 'title', 'component', 'clientReference']

function escapeLike(text: string): string {
  return `%${text.replace(/[\\%_]/g, (char) => `\\${char}`)}%`
}

function filtered(db: Knex, query: CaseListQuery, scope: number | undefined, staff: boolean) {
  const cases = db('cases')
  if (scope !== undefined) cases.where('cases.organisationId', scope)
  if (query.organisationId) cases.where('cases.organisationId', query.organisationId)
  if (query.status) cases.where('cases.status', query.status)
  if (query.stage) cases.whereIn('cases.status', statesOfStage(query.stage))
  if (query.q) {
    const like = escapeLike(query.q)
    const columns = staff ? STAFF_SEARCH : CLIENT_SEARCH
    cases.where((where) => {
      for (const column of columns) where.orWhere(`cases.${column}`, 'like', like)
    })
  }
  return cases
}

/** One page of cases: staff see the working summary, clients their plain status lines. */
export async function listCases(
  { actor, db }: ServiceContext,
  query: CaseListQuery,
): Promise<{ data: CaseSummary[] | ClientCaseView[]; page: Page }> {
  const staff = isStaff(actor)
  const cases = filtered(db, query, organisationScope(actor), staff)
  const [{ total }] = (await cases.clone().count({ total: '*' })) as [{ total: number }]
  const rows = await db('cases')
    .join('organisations', 'organisations.id', 'cases.organisationId')
    .leftJoin('users as lead', 'lead.id', 'cases.leadInvestigatorId')
    .select(
      'cases.*',
      'organisations.name as organisationName',
      'lead.name as leadInvestigatorName',
    )
    .whereIn('cases.id', cases.clone().select('cases.id'))
    .orderBy('cases.createdAt', 'desc')
    .orderBy('cases.id', 'desc')
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
  const page: Page = { number: query.page, size: query.pageSize, total: Number(total) }
  return { data: staff ? rows.map(toSummary) : rows.map(toClientView), page }
}
