import { describe, expect, it } from 'vitest'
import { nextTryAt } from '../../../server/mail/retry-schedule'

// The default schedule: 1, 5, 30 minutes, then hourly, giving up after a day.
const policy = { retryMinutes: [1, 5, 30, 60], giveUpHours: 24 }
const queuedAt = new Date('2026-12-01T00:00:00Z')
const minutesAfter = (minutes: number) => new Date(queuedAt.getTime() + minutes * 60_000)

describe('nextTryAt', () => {
  it('waits 1, 5, 30, then 60 minutes after each failed try', () => {
    expect(nextTryAt(policy, queuedAt, minutesAfter(0), 1)).toEqual(minutesAfter(1))
    expect(nextTryAt(policy, queuedAt, minutesAfter(1), 2)).toEqual(minutesAfter(6))
    expect(nextTryAt(policy, queuedAt, minutesAfter(6), 3)).toEqual(minutesAfter(36))
    expect(nextTryAt(policy, queuedAt, minutesAfter(36), 4)).toEqual(minutesAfter(96))
    expect(nextTryAt(policy, queuedAt, minutesAfter(96), 9)).toEqual(minutesAfter(156))
  })

  it('plans nothing past the give-up time', () => {
    expect(nextTryAt(policy, queuedAt, minutesAfter(1380), 27)).toEqual(minutesAfter(1440))
    expect(nextTryAt(policy, queuedAt, minutesAfter(1416), 27)).toBeNull()
  })

  it('follows a configured schedule', () => {
    const quick = { retryMinutes: [0.5, 2], giveUpHours: 1 }
    expect(nextTryAt(quick, queuedAt, minutesAfter(0), 1)).toEqual(minutesAfter(0.5))
    expect(nextTryAt(quick, queuedAt, minutesAfter(10), 5)).toEqual(minutesAfter(12))
    expect(nextTryAt(quick, queuedAt, minutesAfter(59), 5)).toBeNull()
  })
})
