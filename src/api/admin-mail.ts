import type { OutboxMessage, OutboxStatus, ReceivedMailItem } from '../../shared/schemas/mail'
import { request } from './client'

/** What the local SMTP server received (demo mode only: 404 otherwise). */
export async function listReceivedMail(): Promise<ReceivedMailItem[]> {
  const { data } = await request<{ data: ReceivedMailItem[] }>('GET', '/admin/mail')
  return data
}

export async function listOutbox(status: OutboxStatus | null): Promise<OutboxMessage[]> {
  const query = status ? { status } : {}
  const { data } = await request<{ data: OutboxMessage[] }>('GET', '/admin/outbox', { query })
  return data
}

export async function resendMessage(id: number): Promise<OutboxMessage> {
  const { data } = await request<{ data: OutboxMessage }>('POST', `/admin/outbox/${id}/resend`)
  return data
}
