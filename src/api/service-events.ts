import type {
  AttachmentInfo,
  ServiceEvent,
  ServiceEventCreate,
  ServiceEventUpdate,
} from '../../shared/schemas/service-events'
import { request } from './client'

const base = (caseId: number) => `/cases/${caseId}/service-events`

export async function listServiceEvents(caseId: number): Promise<ServiceEvent[]> {
  const { data } = await request<{ data: ServiceEvent[] }>('GET', base(caseId))
  return data
}

export async function addServiceEvent(caseId: number, event: ServiceEventCreate) {
  const { data } = await request<{ data: ServiceEvent }>('POST', base(caseId), { body: event })
  return data
}

export async function changeServiceEvent(
  caseId: number,
  eventId: number,
  change: ServiceEventUpdate,
) {
  const path = `${base(caseId)}/${eventId}`
  const { data } = await request<{ data: ServiceEvent }>('PATCH', path, { body: change })
  return data
}

export async function removeServiceEvent(caseId: number, eventId: number, version: number) {
  await request<void>('DELETE', `${base(caseId)}/${eventId}`, { body: { version } })
}

export async function attachDocument(caseId: number, eventId: number, file: File) {
  const form = new FormData()
  form.append('file', file)
  const path = `${base(caseId)}/${eventId}/attachments`
  const { data } = await request<{ data: AttachmentInfo }>('POST', path, { form })
  return data
}

/** Where the browser opens an attachment (the API checks access on every request). */
export const attachmentUrl = (attachmentId: number) => `/api/attachments/${attachmentId}`
