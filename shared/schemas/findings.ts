import { z } from 'zod/mini'
import type { FindingsDocument } from '../findings/document'
import type { FindingsFlag } from '../findings/flags'
import type { LiveBlockSnapshots } from '../findings/live-blocks'

/** The draft as saved: the document is checked node by node on the server (`checkDocument`). */
export const FindingsSave = z.strictObject({
  doc: z.unknown().check(z.refine((value) => value !== undefined, 'Send the draft as "doc".')),
  version: z
    .int({ error: 'Send the version you edited.' })
    .check(z.nonnegative('Send the version you edited.')),
})
export type FindingsSave = z.output<typeof FindingsSave>

export interface FindingsAuthor {
  id: number
  name: string
  lastSavedAt: string
}

export interface FindingsView {
  doc: FindingsDocument
  /** the draft rendered for reading, built by the server from the checked document */
  html: string
  /** 0 until the first save: the draft is then the template */
  version: number
  updatedAt: string | null
  updatedBy: number | null
  updatedByName: string | null
  /** everyone who saved the draft since the last issued revision */
  authors: FindingsAuthor[]
  flags: FindingsFlag[]
  /** the live blocks' current data, as the HTML shows them */
  liveBlocks: LiveBlockSnapshots
}
