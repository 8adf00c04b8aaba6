/** Blocks of the draft that show the case's current data; frozen into an issued revision. */
export const LIVE_BLOCK_KINDS = ['tensile_results', 'service_history', 'samples'] as const
export type LiveBlockKind = (typeof LIVE_BLOCK_KINDS)[number]

export const LIVE_BLOCK_TITLES: Record<LiveBlockKind, string> = {
  tensile_results: 'Tensile results and conformity',
  service_history: 'Service history',
  samples: 'Items received and examined',
}

/**
 * A live block as data: a table of already formatted text (values with their units), with notes
 * under it (the standard used, the conformity statement, cautions). The server makes it from the
 * case; the HTML and PDF renderers only lay it out, so a frozen copy renders the same forever.
 */
export interface LiveBlockSnapshot {
  kind: LiveBlockKind
  title: string
  columns: string[]
  rows: string[][]
  notes: string[]
  /** when the data was read, ISO 8601 */
  takenAt: string
}

export type LiveBlockSnapshots = Partial<Record<LiveBlockKind, LiveBlockSnapshot>>

export const isLiveBlockKind = (value: unknown): value is LiveBlockKind =>
  typeof value === 'string' && (LIVE_BLOCK_KINDS as readonly string[]).includes(value)
