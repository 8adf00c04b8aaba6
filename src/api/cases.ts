import type { Page, PageEnvelope } from '../../shared/api/envelope'
import type { ActivityEntry, ActivityKind } from '../../shared/schemas/activity'
import type { Mechanism } from '../../shared/schemas/case-vocabulary'
import type {
  CaseCreate,
  CaseDetail,
  CaseSort,
  CaseSummary,
  CaseUpdate,
  ClientCaseView,
} from '../../shared/schemas/cases'
import type { CaseState, ClientStage } from '../../shared/workflow/case-states'
import { IDEMPOTENCY_HEADER } from '../../shared/api/idempotency'
import { request } from './client'

export interface CaseListFilter {
  page: number
  pageSize: number
  status?: CaseState
  stage?: ClientStage
  organisationId?: number
  investigatorId?: number
  overdue?: boolean
  safetyCritical?: boolean
  material?: string
  mechanism?: Mechanism
  q?: string
  sort?: CaseSort
  order?: 'asc' | 'desc'
}

/** Staff receive the working summary of each case, clients their plain status lines. */
export type CaseListItem = CaseSummary | ClientCaseView

export interface CaseListPage {
  cases: CaseListItem[]
  page: Page
}

/** A case as the signed-in person may see it. */
export type CaseView = CaseDetail | ClientCaseView

export const isCaseDetail = (view: CaseView): view is CaseDetail => 'version' in view

export async function listCases(filter: CaseListFilter): Promise<CaseListPage> {
  const query = Object.fromEntries(
    Object.entries(filter).map(([key, value]) => [
      key,
      value === undefined ? undefined : String(value),
    ]),
  )
  const { data, page } = await request<PageEnvelope<CaseListItem>>('GET', '/cases', { query })
  return { cases: data, page }
}

export async function fetchCase(id: number): Promise<CaseView> {
  const { data } = await request<{ data: CaseView }>('GET', `/cases/${id}`)
  return data
}

/** The same `idempotencyKey` with the same case makes it once (see shared/api/idempotency.ts). */
export async function createCase(newCase: CaseCreate, idempotencyKey: string): Promise<CaseDetail> {
  const { data } = await request<{ data: CaseDetail }>('POST', '/cases', {
    body: newCase,
    headers: { [IDEMPOTENCY_HEADER]: idempotencyKey },
  })
  return data
}

export async function updateCase(id: number, change: CaseUpdate): Promise<CaseDetail> {
  const { data } = await request<{ data: CaseDetail }>('PATCH', `/cases/${id}`, { body: change })
  return data
}

export async function changeCaseStatus(id: number, status: CaseState): Promise<CaseDetail> {
  const { data } = await request<{ data: CaseDetail }>('POST', `/cases/${id}/status`, {
    body: { status },
  })
  return data
}

export interface ActivityFilter {
  page: number
  pageSize: number
  actorId?: number
  kind?: ActivityKind
}

export async function fetchActivity(
  caseId: number,
  filter: ActivityFilter,
): Promise<PageEnvelope<ActivityEntry>> {
  return request<PageEnvelope<ActivityEntry>>('GET', `/cases/${caseId}/activity`, {
    query: { ...filter },
  })
}
