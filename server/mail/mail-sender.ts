import type { Knex } from 'knex'
import { renderNotice } from '../services/notices/render'
import {
  claimDueRows,
  recordFailed,
  recordSent,
  storedNoticeOf,
  type OutboxRow,
} from './outbox-rows'
import { nextTryAt, type RetryPolicy } from './retry-schedule'
import type { MailTransport } from './smtp-transport'

export interface MailSenderDeps {
  db: Knex
  transport: MailTransport
  /** the base of every link in a message */
  publicUrl: string
  from: string
  policy: RetryPolicy
  clock?: () => Date
  pollMs?: number
  log?: (message: string) => void
}

const BATCH = 20

const messageOf = (error: unknown) =>
  (error instanceof Error ? error.message : String(error)).slice(0, 2000)

/**
 * Delivers the outbox at least once per row: a row is marked sent only after the SMTP server
 * took it, so a crash between the two repeats it, with the same Message-ID.
 */
export function createMailSender(deps: MailSenderDeps) {
  const { db, transport, publicUrl, from, policy } = deps
  const clock = deps.clock ?? (() => new Date())
  const pollMs = deps.pollMs ?? 5_000
  const log = deps.log ?? ((message: string) => console.error(message))
  let timer: NodeJS.Timeout | undefined
  let running: Promise<unknown> = Promise.resolve()
  let stopped = true

  async function deliver(row: OutboxRow): Promise<boolean> {
    const to = { name: row.toName, address: row.toAddress }
    try {
      const rendered = renderNotice(storedNoticeOf(row), publicUrl)
      await transport.send({ from, to, ...rendered, messageId: row.messageId })
    } catch (error) {
      const at = clock()
      const next = nextTryAt(policy, row.queuedAt, at, row.attempts + 1)
      await recordFailed(db, row, at, messageOf(error), next)
      return false
    }
    await recordSent(db, row, clock())
    return true
  }

  /** One pass over the due rows; answers how many went out and how many failed this time. */
  async function runOnce(): Promise<{ sent: number; failed: number }> {
    const counts = { sent: 0, failed: 0 }
    for (;;) {
      const rows = await claimDueRows(db, clock(), BATCH)
      for (const row of rows) {
        if (await deliver(row)) counts.sent += 1
        else counts.failed += 1
      }
      if (rows.length < BATCH || stopped) return counts
    }
  }

  function schedule() {
    if (stopped) return
    timer = setTimeout(() => {
      running = runOnce()
        .catch((error: unknown) => log(`Mail sender: ${messageOf(error)}`))
        .finally(schedule)
    }, pollMs)
    timer.unref()
  }

  return {
    runOnce,
    start() {
      if (!stopped) return
      stopped = false
      schedule()
    },
    /** Stops polling and waits for the pass in progress; the transport is closed after it. */
    async stop() {
      stopped = true
      clearTimeout(timer)
      await running
      transport.close()
    },
  }
}

export type MailSender = ReturnType<typeof createMailSender>
