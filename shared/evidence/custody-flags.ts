import type { CustodyEvent, CustodyFlag } from '../schemas/samples'

/** How parties are compared along the chain: trimmed, without regard to case. */
export const sameParty = (a: string, b: string) =>
  a.trim().toLocaleLowerCase('en') === b.trim().toLocaleLowerCase('en')

/**
 * The chain as it stands: in time order, each corrected event replaced by the events that
 * correct it (a correction is a new event naming the one it corrects, ASTM E1188 practice).
 */
export function effectiveChain(events: readonly CustodyEvent[]): CustodyEvent[] {
  const corrected = new Set(events.map((event) => event.corrects).filter((id) => id !== null))
  return events
    .filter((event) => !corrected.has(event.id))
    .sort((a, b) => a.at.localeCompare(b.at) || a.id - b.id)
}

/**
 * What the item page warns about: a gap wherever an event's `from` is not the previous event's
 * `to`; an item whose last event sent it out; an item with no current location.
 */
export function custodyFlags(
  events: readonly CustodyEvent[],
  storageLocation: string | null,
): CustodyFlag[] {
  const chain = effectiveChain(events)
  const flags: CustodyFlag[] = []
  chain.forEach((event, index) => {
    const previous = chain[index - 1]
    if (previous && !sameParty(previous.to, event.from)) {
      flags.push({
        kind: 'custody_gap',
        eventId: event.id,
        expectedFrom: previous.to,
        from: event.from,
      })
    }
  })
  const last = chain.at(-1)
  if (last?.kind === 'sent_out') flags.push({ kind: 'sent_out', eventId: last.id })
  const gone = last?.kind === 'disposed' || last?.kind === 'returned_to_client'
  if (!gone && !storageLocation?.trim()) flags.push({ kind: 'no_location' })
  return flags
}
