import type { FindingsView } from '../../shared/schemas/findings'
import type { ReviewComment, ReviewCommentCreate, ReviewView } from '../../shared/schemas/review'
import type { CaseState } from '../../shared/workflow/case-states'
import { request } from './client'

/** The case's state after a review step, with the review as it now stands. */
export interface ReviewStepResult {
  status: CaseState
  review: ReviewView
}

export async function fetchReview(caseId: number): Promise<ReviewView> {
  const { data } = await request<{ data: ReviewView }>('GET', `/cases/${caseId}/review`)
  return data
}

/** The draft as the reviewer reads it (the server's own rendering). */
export async function fetchDraftForReview(caseId: number): Promise<FindingsView> {
  const { data } = await request<{ data: FindingsView }>('GET', `/cases/${caseId}/findings`)
  return data
}

async function step(caseId: number, path: string, body?: object): Promise<ReviewStepResult> {
  const { data } = await request<{ data: ReviewStepResult }>(
    'POST',
    `/cases/${caseId}/review/${path}`,
    { body: body ?? {} },
  )
  return data
}

export const submitForReview = (caseId: number) => step(caseId, 'submit')
export const requestRevisions = (caseId: number, reason: string) =>
  step(caseId, 'request-revisions', { reason })
export const approveDraft = (caseId: number) => step(caseId, 'approve')

export async function listComments(caseId: number): Promise<ReviewComment[]> {
  const path = `/cases/${caseId}/review/comments`
  const { data } = await request<{ data: ReviewComment[] }>('GET', path)
  return data
}

export async function addComment(
  caseId: number,
  input: ReviewCommentCreate,
): Promise<ReviewComment> {
  const path = `/cases/${caseId}/review/comments`
  const { data } = await request<{ data: ReviewComment }>('POST', path, { body: input })
  return data
}

export async function resolveComment(caseId: number, commentId: number): Promise<ReviewComment> {
  const path = `/cases/${caseId}/review/comments/${commentId}/resolve`
  const { data } = await request<{ data: ReviewComment }>('POST', path, { body: {} })
  return data
}
