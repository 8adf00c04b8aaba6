import type { HoldCreate, LegalHold } from '../../shared/schemas/holds'
import type { Notice, NoticeAnswerCreate, NoticeCreate } from '../../shared/schemas/notices'
import type { Observation, ObservationCreate } from '../../shared/schemas/observations'
import type {
  CustodyEventCreate,
  Sample,
  SampleCreate,
  SampleDetail,
} from '../../shared/schemas/samples'
import { request } from './client'

const base = (caseId: number) => `/cases/${caseId}`

async function get<T>(path: string): Promise<T> {
  return (await request<{ data: T }>('GET', path)).data
}
async function post<T>(path: string, body: unknown): Promise<T> {
  return (await request<{ data: T }>('POST', path, { body })).data
}

export const listSamples = (caseId: number) => get<Sample[]>(`${base(caseId)}/samples`)
export const fetchSample = (caseId: number, sampleId: number) =>
  get<SampleDetail>(`${base(caseId)}/samples/${sampleId}`)
export const receiveSample = (caseId: number, sample: SampleCreate) =>
  post<SampleDetail>(`${base(caseId)}/samples`, sample)
export const addCustodyEvent = (caseId: number, sampleId: number, event: CustodyEventCreate) =>
  post<SampleDetail>(`${base(caseId)}/samples/${sampleId}/custody-events`, event)

export const listNotices = (caseId: number) => get<Notice[]>(`${base(caseId)}/notices`)
export const recordNotice = (caseId: number, notice: NoticeCreate) =>
  post<Notice>(`${base(caseId)}/notices`, notice)
export const recordAnswer = (caseId: number, noticeId: number, answer: NoticeAnswerCreate) =>
  post<Notice>(`${base(caseId)}/notices/${noticeId}/answers`, answer)
export const resolveObjection = (
  caseId: number,
  noticeId: number,
  answerId: number,
  resolution: string,
) =>
  post<Notice>(`${base(caseId)}/notices/${noticeId}/answers/${answerId}/resolution`, {
    resolution,
  })
export const fetchNoticePeriod = async (caseId: number) =>
  (await get<{ days: number }>(`${base(caseId)}/notice-period`)).days
export async function saveNoticePeriod(caseId: number, days: number): Promise<number> {
  const path = `${base(caseId)}/notice-period`
  return (await request<{ data: { days: number } }>('PUT', path, { body: { days } })).data.days
}

export const listHolds = (caseId: number) => get<LegalHold[]>(`${base(caseId)}/holds`)
export const placeHold = (caseId: number, hold: HoldCreate) =>
  post<LegalHold>(`${base(caseId)}/holds`, hold)
export const releaseHold = (caseId: number, holdId: number, reason: string) =>
  post<LegalHold>(`${base(caseId)}/holds/${holdId}/release`, { reason })

export const listObservations = (caseId: number) =>
  get<Observation[]>(`${base(caseId)}/observations`)
export const recordObservation = (caseId: number, observation: ObservationCreate) =>
  post<Observation>(`${base(caseId)}/observations`, observation)
export const withdrawObservation = (caseId: number, observationId: number, reason: string) =>
  post<Observation>(`${base(caseId)}/observations/${observationId}/withdraw`, { reason })
