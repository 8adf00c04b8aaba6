export interface RetryPolicy {
  /** waits between tries, in minutes; the last one repeats (default 1, 5, 30, then hourly) */
  retryMinutes: readonly number[]
  /** no try is planned later than this after the message was queued */
  giveUpHours: number
}

const MINUTE_MS = 60_000

/**
 * When to try a message again after its `failedTries`-th failed try at `failedAt`, or null when
 * that would be past the give-up time counted from `queuedAt`.
 */
export function nextTryAt(
  policy: RetryPolicy,
  queuedAt: Date,
  failedAt: Date,
  failedTries: number,
): Date | null {
  const { retryMinutes, giveUpHours } = policy
  const wait = retryMinutes[Math.min(failedTries, retryMinutes.length) - 1] ?? 60
  const next = new Date(failedAt.getTime() + wait * MINUTE_MS)
  const giveUpAt = queuedAt.getTime() + giveUpHours * 60 * MINUTE_MS
  return next.getTime() > giveUpAt ? null : next
}
