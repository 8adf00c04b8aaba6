import { describe, expect, it } from 'vitest'
import {
  CASE_STATES,
  CASE_STATE_LABELS,
  CASE_TRANSITIONS,
  checkTransition,
  nextStates,
} from '../../shared/workflow/case-states'

describe('the case state table', () => {
  it('has a plain label for every state', () => {
    for (const state of CASE_STATES) expect(CASE_STATE_LABELS[state]).toMatch(/^[A-Z]/)
  })

  it('follows intake → … → closed, with review going back and forth and amendments', () => {
    const pairs = CASE_TRANSITIONS.map((transition) => `${transition.from}>${transition.to}`)
    expect(pairs.sort()).toEqual(
      [
        'intake>examination',
        'examination>drafting',
        'drafting>in_review',
        'in_review>revisions_requested',
        'revisions_requested>in_review',
        'in_review>approved',
        'approved>issued',
        'issued>closed',
        'issued>drafting',
        'closed>drafting',
      ].sort(),
    )
  })

  it('lets investigators make the plain steps', () => {
    expect(checkTransition('intake', 'examination', ['investigator']).allowed).toBe(true)
    expect(checkTransition('issued', 'closed', ['investigator']).allowed).toBe(true)
  })

  it('leaves an issued or closed case only through an amendment (ISO/IEC 17025 7.8.8)', () => {
    for (const from of ['issued', 'closed'] as const) {
      expect(checkTransition(from, 'drafting', ['admin'])).toEqual({
        allowed: false,
        reason: 'route',
      })
      expect(checkTransition(from, 'drafting', ['investigator'], 'amend').allowed).toBe(true)
      expect(checkTransition(from, 'drafting', ['reviewer'], 'amend').allowed).toBe(false)
    }
  })

  it('refuses a step that is not in the table', () => {
    expect(checkTransition('intake', 'closed', ['admin'])).toEqual({
      allowed: false,
      reason: 'no_such_transition',
    })
  })

  it('refuses a role that may not make the step', () => {
    expect(checkTransition('intake', 'examination', ['lab'])).toEqual({
      allowed: false,
      reason: 'role',
    })
    expect(checkTransition('in_review', 'approved', ['investigator'], 'review')).toEqual({
      allowed: false,
      reason: 'role',
    })
  })

  it('keeps review and issue steps to their own actions', () => {
    expect(checkTransition('drafting', 'in_review', ['investigator'])).toEqual({
      allowed: false,
      reason: 'route',
    })
    expect(checkTransition('in_review', 'approved', ['reviewer'], 'review').allowed).toBe(true)
    expect(checkTransition('approved', 'issued', ['investigator'], 'issue').allowed).toBe(true)
  })

  it('offers only the plain next steps a role may take', () => {
    expect(nextStates('intake', ['investigator'])).toEqual(['examination'])
    expect(nextStates('issued', ['admin'])).toEqual(['closed'])
    expect(nextStates('closed', ['admin'])).toEqual([])
    expect(nextStates('drafting', ['investigator'])).toEqual([])
    expect(nextStates('intake', ['client'])).toEqual([])
  })
})
