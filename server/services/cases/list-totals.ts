import type { CaseListQuery } from '../../../shared/schemas/cases'

/** How long the total of an unfiltered list is kept before it is counted again. */
export const LIST_TOTAL_KEEP_MS = 5_000

const PAGING_AND_ORDER = new Set(['page', 'pageSize', 'sort', 'order'])

/** The key of a list's total when the list is the person's whole scope, else undefined. */
export function wholeScopeKey(query: CaseListQuery, scope: number | undefined): string | undefined {
  const filtered = Object.entries(query).some(
    ([name, value]) => !PAGING_AND_ORDER.has(name) && value !== undefined && value !== '',
  )
  return filtered ? undefined : `scope:${scope ?? 'all'}`
}

export interface ListTotals {
  get: (key: string) => number | undefined
  keep: (key: string, total: number) => void
  /** Forgets every total: a case was created or moved between organisations. */
  forget: () => void
}

/**
 * The totals of unfiltered lists (all cases for staff, an organisation's for its clients), kept
 * a few seconds: counting every case costs more than reading the page, and these totals change
 * only when a case is created or moves to another organisation, which this process makes
 * forget at once. Another process's new case shows in the total within `keepMs`; the rows
 * themselves are always read fresh. Filtered totals count only an index range and are not kept.
 */
export function createListTotals(
  keepMs = LIST_TOTAL_KEEP_MS,
  now: () => number = Date.now,
): ListTotals {
  const kept = new Map<string, { total: number; until: number }>()
  return {
    get: (key) => {
      const entry = kept.get(key)
      return entry && entry.until > now() ? entry.total : undefined
    },
    keep: (key, total) => {
      if (keepMs > 0) kept.set(key, { total, until: now() + keepMs })
    },
    forget: () => kept.clear(),
  }
}
