import type {
  ReadableReport,
  ReportQuestion,
  ReportSummary,
  ReportView,
} from '../../shared/schemas/reports'
import { request } from './client'

export async function listCaseReports(caseId: number): Promise<ReportSummary[]> {
  const { data } = await request<{ data: ReportSummary[] }>('GET', `/cases/${caseId}/reports`)
  return data
}

/** Every revision the person may read (a client: their organisation's), newest first. */
export async function listReadableReports(): Promise<ReadableReport[]> {
  const { data } = await request<{ data: ReadableReport[] }>('GET', '/reports')
  return data
}

export async function fetchReport(reportId: number): Promise<ReportView> {
  const { data } = await request<{ data: ReportView }>('GET', `/reports/${reportId}`)
  return data
}

export async function issueReport(caseId: number): Promise<ReportView> {
  const { data } = await request<{ data: ReportView }>('POST', `/cases/${caseId}/issue`, {
    body: {},
  })
  return data
}

export async function amendReport(caseId: number, reason: string): Promise<void> {
  await request('POST', `/cases/${caseId}/amend`, { body: { reason } })
}

export async function acknowledgeReport(reportId: number): Promise<string> {
  const path = `/reports/${reportId}/acknowledge`
  const { data } = await request<{ data: { acknowledgedAt: string } }>('POST', path, { body: {} })
  return data.acknowledgedAt
}

export async function askQuestion(reportId: number, body: string): Promise<ReportQuestion> {
  const path = `/reports/${reportId}/questions`
  const { data } = await request<{ data: ReportQuestion }>('POST', path, { body: { body } })
  return data
}

export async function answerQuestion(
  reportId: number,
  questionId: number,
  body: string,
): Promise<ReportQuestion> {
  const path = `/reports/${reportId}/questions/${questionId}/answers`
  const { data } = await request<{ data: ReportQuestion }>('POST', path, { body: { body } })
  return data
}
