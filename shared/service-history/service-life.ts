import type { ServiceEventKind } from '../schemas/service-events'

export interface LifeEvent {
  kind: ServiceEventKind
  occurredOn: string
  /** operating hours on the meter at the event */
  hours: number | null
  /** load cycles counted up to the event */
  cycles: number | null
}

export interface ServiceLife {
  /** the day service began: first installation, else manufacture */
  from: string | null
  /** the day it ended: the failure event, else the case's failure date, else today */
  to: string
  /** false when no failure is recorded yet and the life runs to today */
  ended: boolean
  years: number | null
  hours: number | null
  cycles: number | null
}

const DAY_MS = 86_400_000
const DAYS_PER_YEAR = 365.25

const dayNumber = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / DAY_MS

/** The last reading on or before `to`: meters only count up, so the latest is the total. */
function readingAt(events: LifeEvent[], to: string, pick: (event: LifeEvent) => number | null) {
  let value: number | null = null
  for (const event of events) {
    const reading = pick(event)
    if (event.occurredOn <= to && reading !== null) value = Math.max(value ?? reading, reading)
  }
  return value
}

/**
 * Cumulative service life from the timeline: years from entering service to the failure, and the
 * hour and cycle meters' readings at the failure (or the latest reading before it).
 */
export function serviceLife(
  events: readonly LifeEvent[],
  options: { failureDate: string | null; today: string },
): ServiceLife {
  const sorted = [...events].sort((a, b) => a.occurredOn.localeCompare(b.occurredOn))
  const first = (kind: ServiceEventKind) => sorted.find((event) => event.kind === kind)
  const start = first('installation') ?? first('manufacture')
  const failure = first('failure')
  const to = failure?.occurredOn ?? options.failureDate ?? options.today
  const from = start?.occurredOn ?? null
  const years =
    from === null ? null : Math.round(((dayNumber(to) - dayNumber(from)) / DAYS_PER_YEAR) * 10) / 10
  return {
    from,
    to,
    ended: Boolean(failure ?? options.failureDate),
    years,
    hours: readingAt(sorted, to, (event) => event.hours),
    cycles: readingAt(sorted, to, (event) => event.cycles),
  }
}
