import { z } from 'zod/mini'

export const OUTBOX_STATUSES = ['queued', 'sent', 'failed'] as const
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number]

export const OutboxListQuery = z.strictObject({
  status: z.optional(z.enum(OUTBOX_STATUSES, { error: 'Use queued, sent or failed.' })),
})
export type OutboxListQuery = z.output<typeof OutboxListQuery>

/** One try to deliver an outbox message. */
export interface OutboxAttempt {
  attemptedAt: string
  outcome: 'sent' | 'failed'
  error: string | null
}

/** An outbox message as administrators see it. */
export interface OutboxMessage {
  id: number
  kind: string
  caseId: number | null
  to: string
  toName: string
  subject: string
  messageId: string
  status: OutboxStatus
  attempts: OutboxAttempt[]
  queuedAt: string
  nextAttemptAt: string | null
  sentAt: string | null
  lastError: string | null
}

/** What the local SMTP server received (demo mode). */
export interface ReceivedMailItem {
  id: number
  messageId: string | null
  to: string
  subject: string
  text: string
  receivedAt: string
}
