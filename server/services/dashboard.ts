import type { Knex } from 'knex'
import { isStaff, organisationScope } from '../../shared/access/policy'
import type { Mechanism } from '../../shared/schemas/case-vocabulary'
import type { Dashboard, DashboardList, DashboardListKey } from '../../shared/schemas/dashboard'
import { todayIso } from '../../shared/schemas/dates'
import type { CaseState } from '../../shared/workflow/case-states'
import { toClientView, toSummary } from './cases/case-record'
import { FINISHED_STATES } from './cases/case-list'
import type { ServiceContext } from './context'

const LIST_SIZE = 10
const WEEK_MS = 7 * 86_400_000

type Narrow = (query: Knex.QueryBuilder) => void

function inScope(ctx: ServiceContext): Knex.QueryBuilder {
  const query = ctx.db('cases')
  const scope = organisationScope(ctx.actor)
  if (scope !== undefined) query.where('cases.organisationId', scope)
  return query
}

async function listOf(ctx: ServiceContext, narrow: Narrow, order: [string, 'asc' | 'desc']) {
  const query = inScope(ctx)
  narrow(query)
  const rows = await query
    .join('organisations', 'organisations.id', 'cases.organisationId')
    .leftJoin('users as lead', 'lead.id', 'cases.leadInvestigatorId')
    .select(
      'cases.*',
      'organisations.name as organisationName',
      'lead.name as leadInvestigatorName',
    )
    .orderBy(order[0], order[1])
    .orderBy('cases.id', 'desc')
    .limit(LIST_SIZE)
  return isStaff(ctx.actor) ? rows.map(toSummary) : rows.map(toClientView)
}

/** The person's own open cases: lead or co-investigator, not yet issued or closed. */
function mine(ctx: ServiceContext): Narrow {
  const me = ctx.actor.id
  return (query) =>
    query
      .whereNotIn('cases.status', FINISHED_STATES)
      .where((who) =>
        who
          .where('cases.leadInvestigatorId', me)
          .orWhereExists((co) =>
            co
              .select('case_co_investigators.case_id')
              .from('case_co_investigators')
              .where('case_co_investigators.user_id', me)
              .whereRaw('case_co_investigators.case_id = cases.id'),
          ),
      )
}

/** Which lists each person sees, and what goes into them. */
function plans(ctx: ServiceContext, today: string, weekAhead: string) {
  const roles = ctx.actor.roles
  const open: Narrow = (query) => query.whereNotIn('cases.status', FINISHED_STATES)
  const myOpen = mine(ctx)
  // administrators watch every deadline; investigators their own
  const watched = roles.includes('admin') ? open : myOpen
  const byDue: [string, 'asc'] = ['cases.dueDate', 'asc']
  const plan: [DashboardListKey, Narrow, [string, 'asc' | 'desc']][] = []
  if (!isStaff(ctx.actor)) {
    plan.push(['ourOpen', open, ['cases.createdAt', 'desc']])
  }
  if (roles.includes('investigator')) plan.push(['myOpen', myOpen, byDue])
  if (roles.includes('investigator') || roles.includes('admin')) {
    const overdue: Narrow = (query) => {
      watched(query)
      query.where('cases.dueDate', '<', today)
    }
    const thisWeek: Narrow = (query) => {
      watched(query)
      query.whereBetween('cases.dueDate', [today, weekAhead])
    }
    plan.push(['overdue', overdue, byDue], ['dueThisWeek', thisWeek, byDue])
  }
  if (roles.includes('reviewer')) {
    const awaiting: Narrow = (q) =>
      q.where({ 'cases.reviewerId': ctx.actor.id, 'cases.status': 'in_review' })
    plan.push(['awaitingMyReview', awaiting, byDue])
  }
  if (roles.includes('lab')) {
    const awaiting: Narrow = (q) =>
      q
        .where('cases.labTechnicianId', ctx.actor.id)
        .whereIn('cases.status', ['intake', 'examination'])
    plan.push(['awaitingLab', awaiting, byDue])
  }
  plan.push([
    'recentlyIssued',
    (q) => q.where('cases.status', 'issued'),
    ['cases.updatedAt', 'desc'],
  ])
  return plan
}

async function counts(ctx: ServiceContext): Promise<Pick<Dashboard, 'byState' | 'byMechanism'>> {
  if (!isStaff(ctx.actor)) return { byState: [], byMechanism: [] }
  const states = (await ctx
    .db('cases')
    .select('status')
    .count({ count: '*' })
    .groupBy('status')) as { status: CaseState; count: number }[]
  const mechanisms = (await ctx
    .db('case_terms')
    .where('kind', 'mechanism')
    .select('term')
    .count({ count: '*' })
    .groupBy('term')
    .orderBy('count', 'desc')) as { term: Mechanism; count: number }[]
  return {
    byState: states.map((row) => ({ state: row.status, count: Number(row.count) })),
    byMechanism: mechanisms.map((row) => ({ mechanism: row.term, count: Number(row.count) })),
  }
}

/** The home page of the signed-in person: their lists first, then the counts for the charts. */
export async function dashboardFor(
  ctx: ServiceContext,
  now: Date = new Date(),
): Promise<Dashboard> {
  const today = todayIso(now)
  const weekAhead = todayIso(new Date(now.getTime() + WEEK_MS))
  const [lists, totals] = await Promise.all([
    Promise.all(
      plans(ctx, today, weekAhead).map(async ([key, narrow, order]): Promise<DashboardList> => ({
        key,
        cases: await listOf(ctx, narrow, order),
      })),
    ),
    counts(ctx),
  ])
  return { lists, ...totals }
}
