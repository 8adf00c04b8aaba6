import { describe, expect, it } from 'vitest'
import { custodyFlags, effectiveChain } from '../../../shared/evidence/custody-flags'
import type { CustodyEvent, CustodyKind } from '../../../shared/schemas/samples'

let nextId = 1
function event(
  kind: CustodyKind,
  from: string,
  to: string,
  at: string,
  corrects: number | null = null,
): CustodyEvent {
  return {
    id: nextId++,
    sampleId: 1,
    kind,
    from,
    to,
    at: `${at}T09:00:00.000Z`,
    purpose: null,
    condition: null,
    location: null,
    corrects,
    correctedBy: null,
    enteredBy: 1,
    enteredByName: null,
    createdAt: `${at}T09:00:00.000Z`,
  }
}

// The chain of custody must be continuous: each hand-over starts where the previous one ended
// (ASTM E1188, documentation of custody; the comparison rule — trimmed, case-insensitive — is
// the product's, stated in the evidence issue).
describe('custody flags', () => {
  it('finds no gap when each event starts with the previous one’s receiver, ignoring case and spaces', () => {
    const events = [
      event('received', 'Client site', 'A. Jones', '2026-01-02'),
      event('transferred', '  a. jones ', 'Evidence store', '2026-01-03'),
      event('transferred', 'EVIDENCE STORE', 'Metallography lab', '2026-01-04'),
    ]
    expect(custodyFlags(events, 'Metallography lab')).toEqual([])
  })

  it('flags a gap at the event whose `from` differs from the previous `to`', () => {
    const events = [
      event('received', 'Client site', 'A. Jones', '2026-01-02'),
      event('transferred', 'B. Smith', 'Evidence store', '2026-01-03'),
    ]
    expect(custodyFlags(events, 'Evidence store')).toEqual([
      { kind: 'custody_gap', eventId: events[1]!.id, expectedFrom: 'A. Jones', from: 'B. Smith' },
    ])
  })

  it('compares in time order, not in the order events were entered', () => {
    const late = event('transferred', 'A. Jones', 'Store', '2026-01-05')
    const early = event('received', 'Client', 'A. Jones', '2026-01-01')
    expect(custodyFlags([late, early], 'Store')).toEqual([])
  })

  it('lets a correction stand in for the event it corrects, closing the gap', () => {
    const received = event('received', 'Client site', 'A. Jones', '2026-01-02')
    const wrong = event('transferred', 'B. Smith', 'Evidence store', '2026-01-03')
    const fix = event('transferred', 'A. Jones', 'Evidence store', '2026-01-03', wrong.id)
    expect(effectiveChain([received, wrong, fix]).map((e) => e.id)).toEqual([received.id, fix.id])
    expect(custodyFlags([received, wrong, fix], 'Evidence store')).toEqual([])
  })

  it('flags an item whose last event sent it out, and one with no location', () => {
    const events = [
      event('received', 'Client', 'Lab', '2026-01-02'),
      event('sent_out', 'Lab', 'Outside lab', '2026-01-03'),
    ]
    expect(custodyFlags(events, null)).toEqual([
      { kind: 'sent_out', eventId: events[1]!.id },
      { kind: 'no_location' },
    ])
  })

  it('does not ask for a location once the item was disposed of or returned to the client', () => {
    const events = [
      event('received', 'Client', 'Lab', '2026-01-02'),
      event('returned_to_client', 'Lab', 'Client', '2026-01-03'),
    ]
    expect(custodyFlags(events, '  ')).toEqual([])
  })
})
