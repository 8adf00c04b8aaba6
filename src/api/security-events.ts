import type { PageEnvelope } from '../../shared/api/envelope'
import type { SecurityEvent, SecurityEventKind } from '../../shared/schemas/security-events'
import { request } from './client'

export function listSecurityEvents(query: {
  kind?: SecurityEventKind
  page: number
  pageSize: number
}): Promise<PageEnvelope<SecurityEvent>> {
  return request<PageEnvelope<SecurityEvent>>('GET', '/security-events', { query })
}
