import { describe, expect, it } from 'vitest'
import { CaseListQuery } from '../../shared/schemas/cases'
import { createListTotals, wholeScopeKey } from '../../server/services/cases/list-totals'

const query = (text: Record<string, string>) => CaseListQuery.parse(text)

describe('which case lists keep their total', () => {
  it('keeps the whole scope, whatever the page, size and order', () => {
    expect(wholeScopeKey(query({}), undefined)).toBe('scope:all')
    expect(wholeScopeKey(query({ page: '3', pageSize: '10', sort: 'title' }), 7)).toBe('scope:7')
    expect(wholeScopeKey(query({ q: '' }), undefined)).toBe('scope:all')
  })

  it('never keeps a filtered or searched list', () => {
    const filters: Record<string, string>[] = [
      { status: 'examination' },
      { stage: 'received' },
      { organisationId: '2' },
      { q: 'sheave' },
      { material: '42CrMo4' },
      { overdue: 'true' },
      { safetyCritical: 'false' },
    ]
    for (const filter of filters) {
      expect(wholeScopeKey(query(filter), undefined), JSON.stringify(filter)).toBeUndefined()
    }
  })
})

describe('kept totals', () => {
  it('answers a total until it is older than the keeping time, and forgets on demand', () => {
    let now = 1_000
    const totals = createListTotals(5_000, () => now)
    expect(totals.get('scope:all')).toBeUndefined()
    totals.keep('scope:all', 42)
    totals.keep('scope:3', 7)
    now += 4_999
    expect(totals.get('scope:all')).toBe(42)
    now += 1
    expect(totals.get('scope:all')).toBeUndefined()
    totals.keep('scope:all', 43)
    totals.forget()
    expect(totals.get('scope:all')).toBeUndefined()
    expect(totals.get('scope:3')).toBeUndefined()
  })

  it('keeps nothing when the keeping time is zero', () => {
    const totals = createListTotals(0)
    totals.keep('scope:all', 1)
    expect(totals.get('scope:all')).toBeUndefined()
  })
})
