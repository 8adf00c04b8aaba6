import { describe, expect, it } from 'vitest'
import { addDays, noticeStanding } from '../../../shared/evidence/notice-standing'
import type { NoticeAnswer, NoticeParty } from '../../../shared/schemas/notices'

const party = (id: number): NoticeParty => ({
  id,
  name: `Party ${id}`,
  organisation: null,
  email: null,
  role: 'insurer',
})

let nextId = 1
const answer = (
  partyId: number,
  kind: NoticeAnswer['answer'],
  resolvedAt: string | null = null,
): NoticeAnswer => ({
  id: nextId++,
  partyId,
  answer: kind,
  answeredOn: '2026-03-02',
  comment: null,
  resolution: resolvedAt ? 'Agreed to proceed with a witness present' : null,
  resolvedAt,
  createdAt: '2026-03-02T10:00:00.000Z',
})

// ASTM E860 practice: before altering an item, notify the interested parties of what is planned
// and when, and give them time to attend or object. The period and the unblock rules are the
// product's, stated in the evidence issue.
describe('notice standing', () => {
  const parties = [party(1), party(2)]
  const respondBy = '2026-03-11'

  it('counts calendar days across month ends and leap days (proleptic Gregorian calendar)', () => {
    expect(addDays('2026-03-01', 10)).toBe('2026-03-11')
    expect(addDays('2028-02-25', 10)).toBe('2028-03-06') // 2028 is a leap year
    expect(addDays('2026-12-28', 10)).toBe('2027-01-07')
  })

  it('waits while answers are missing and the period runs', () => {
    const notice = { parties, answers: [answer(1, 'agreed')], respondBy }
    expect(noticeStanding(notice, '2026-03-05')).toBe('waiting')
    expect(noticeStanding(notice, respondBy)).toBe('waiting')
  })

  it('allows the work once every party agreed or will attend', () => {
    const notice = { parties, answers: [answer(1, 'agreed'), answer(2, 'will_attend')], respondBy }
    expect(noticeStanding(notice, '2026-03-03')).toBe('agreed')
  })

  it('allows the work after the period with no objection', () => {
    const notice = { parties, answers: [], respondBy }
    expect(noticeStanding(notice, '2026-03-12')).toBe('period_passed')
  })

  it('blocks on an open objection even after the period, until it is resolved', () => {
    const open = { parties, answers: [answer(1, 'agreed'), answer(2, 'objected')], respondBy }
    expect(noticeStanding(open, '2026-04-30')).toBe('objected')
    const resolved = {
      parties,
      answers: [answer(1, 'agreed'), answer(2, 'objected', '2026-03-04T08:00:00.000Z')],
      respondBy,
    }
    expect(noticeStanding(resolved, '2026-03-05')).toBe('agreed')
  })

  it('takes each party’s latest answer', () => {
    const changedMind = {
      parties,
      answers: [answer(1, 'objected'), answer(1, 'agreed'), answer(2, 'agreed')],
      respondBy,
    }
    expect(noticeStanding(changedMind, '2026-03-05')).toBe('agreed')
    const withdrewAgreement = {
      parties,
      answers: [answer(1, 'agreed'), answer(1, 'objected')],
      respondBy,
    }
    expect(noticeStanding(withdrewAgreement, '2026-03-20')).toBe('objected')
  })

  it('cannot be agreed by nobody: a notice to no party waits out its period', () => {
    const notice = { parties: [], answers: [], respondBy }
    expect(noticeStanding(notice, '2026-03-05')).toBe('waiting')
    expect(noticeStanding(notice, '2026-03-12')).toBe('period_passed')
  })
})
