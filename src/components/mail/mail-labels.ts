import type { OutboxStatus } from '../../../shared/schemas/mail'

export const OUTBOX_STATUS_LABELS: Record<OutboxStatus, string> = {
  queued: 'Waiting',
  sent: 'Sent',
  failed: 'Failed',
}

/** A moment as the reader's own date and time. */
export const whenText = (iso: string | null) =>
  iso === null
    ? '—'
    : new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })
