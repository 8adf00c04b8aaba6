import type { NoticeAnswer, NoticeParty, NoticeStanding } from '../schemas/notices'

/** Each party's latest answer: answers are appended, the last one counts. */
export function latestAnswers(answers: readonly NoticeAnswer[]): Map<number, NoticeAnswer> {
  const latest = new Map<number, NoticeAnswer>()
  for (const answer of [...answers].sort((a, b) => a.id - b.id)) latest.set(answer.partyId, answer)
  return latest
}

/** The day `days` after the ISO day `from`, as YYYY-MM-DD. */
export function addDays(from: string, days: number): string {
  const date = new Date(`${from}T00:00:00Z`)
  date.setUTCDate(date.getUTCDate() + days)
  return date.toISOString().slice(0, 10)
}

/**
 * Whether a notice allows destructive work (ASTM E860 practice: notify, give time to attend or
 * object). An open objection blocks; otherwise every party agreeing, or the notice period having
 * passed (`today` after `respondBy`), allows it. A notice that named no party can only wait out
 * its period.
 */
export function noticeStanding(
  notice: { parties: readonly NoticeParty[]; answers: readonly NoticeAnswer[]; respondBy: string },
  today: string,
): NoticeStanding {
  const latest = latestAnswers(notice.answers)
  const open = [...latest.values()].some((a) => a.answer === 'objected' && a.resolvedAt === null)
  if (open) return 'objected'
  const allAgreed =
    notice.parties.length > 0 &&
    notice.parties.every((party) => {
      const answer = latest.get(party.id)
      // a resolved objection is settled: the administrator's resolution stands for the answer
      return answer !== undefined && (answer.answer !== 'objected' || answer.resolvedAt !== null)
    })
  if (allAgreed) return 'agreed'
  if (today > notice.respondBy) return 'period_passed'
  return 'waiting'
}

export const NOTICE_ALLOWS: readonly NoticeStanding[] = ['agreed', 'period_passed']
