import type { FindingsDocument } from '../../shared/findings/document'
import type { FindingsView } from '../../shared/schemas/findings'
import { request } from './client'

export async function fetchFindings(caseId: number): Promise<FindingsView> {
  const { data } = await request<{ data: FindingsView }>('GET', `/cases/${caseId}/findings`)
  return data
}

/** Saves the draft over the version it was edited from; a stale one answers 409 `version_conflict`. */
export async function saveFindings(
  caseId: number,
  doc: FindingsDocument,
  version: number,
): Promise<FindingsView> {
  const path = `/cases/${caseId}/findings`
  const { data } = await request<{ data: FindingsView }>('PUT', path, { body: { doc, version } })
  return data
}
