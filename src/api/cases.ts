import type { CaseCreate, CaseDetail, CaseSummary } from '../../shared/schemas/cases'
import type { Page } from '../../shared/schemas/common'
import type { CaseState } from '../../shared/workflow/case-states'
import { request } from './client'

export interface CaseListFilter {
  page: number
  pageSize: number
  status?: CaseState
  organisationId?: number
  q?: string
}

export interface CaseListPage {
  cases: CaseSummary[]
  page: Page
}

/** A case as its page shows it, with the states the signed-in person may move it to. */
export type CaseWithNextStates = CaseDetail & { allowedNextStates: CaseState[] }

export async function listCases(filter: CaseListFilter): Promise<CaseListPage> {
  const { data, page } = await request<{ data: CaseSummary[]; page: Page }>('GET', '/cases', {
    query: { ...filter },
  })
  return { cases: data, page }
}

export async function fetchCase(id: number): Promise<CaseWithNextStates> {
  const { data } = await request<{ data: CaseWithNextStates }>('GET', `/cases/${id}`)
  return data
}

export async function createCase(newCase: CaseCreate): Promise<CaseDetail> {
  const { data } = await request<{ data: CaseDetail }>('POST', '/cases', { body: newCase })
  return data
}

export async function changeCaseStatus(id: number, status: CaseState): Promise<CaseWithNextStates> {
  const { data } = await request<{ data: CaseWithNextStates }>('POST', `/cases/${id}/status`, {
    body: { status },
  })
  return data
}
