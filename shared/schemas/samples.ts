import { z } from 'zod/mini'
import { idOf, IsoDate, optionalText, trimmed } from './common'

export const CUT_METHODS = ['saw', 'abrasive', 'wire_edm', 'other'] as const
export type CutMethod = (typeof CUT_METHODS)[number]
export const CUT_METHOD_LABELS: Record<CutMethod, string> = {
  saw: 'Saw',
  abrasive: 'Abrasive cut-off',
  wire_edm: 'Wire EDM',
  other: 'Other',
}

export const CUSTODY_KINDS = [
  'received',
  'transferred',
  'sectioned',
  'sent_out',
  'returned',
  'returned_to_client',
  'disposed',
] as const
export type CustodyKind = (typeof CUSTODY_KINDS)[number]
export const CUSTODY_KIND_LABELS: Record<CustodyKind, string> = {
  received: 'Received',
  transferred: 'Transferred',
  sectioned: 'Sectioned',
  sent_out: 'Sent to an outside lab',
  returned: 'Returned',
  returned_to_client: 'Returned to the client',
  disposed: 'Disposed of',
}

/** Kinds that alter or move an item: refused under a legal hold (sectioning also needs notice). */
export const HELD_KINDS: readonly CustodyKind[] = [
  'transferred',
  'sectioned',
  'sent_out',
  'returned_to_client',
  'disposed',
]

export const SampleCreate = z.strictObject({
  description: trimmed(4000, 'Description'),
  receivedFrom: trimmed(191, 'Received from'),
  receivedOn: IsoDate,
  collectedBy: z._default(optionalText(191, 'Collected by'), null),
  condition: z._default(optionalText(4000, 'Condition'), null),
  packaging: z._default(optionalText(191, 'Packaging'), null),
  storageLocation: z._default(optionalText(191, 'Storage location'), null),
  /** set for a piece cut from another item: the cut is then recorded as sectioning */
  parentId: z._default(z.nullable(idOf('Choose the item the piece was cut from.')), null),
  cutLocation: z._default(optionalText(191, 'Cut location'), null),
  orientation: z._default(optionalText(191, 'Orientation'), null),
  cutMethod: z._default(
    z.nullable(z.enum(CUT_METHODS, { error: 'Choose how the piece was cut.' })),
    null,
  ),
  clientVisible: z.boolean({ error: 'Say whether the client may see this item.' }),
})
export type SampleCreate = z.output<typeof SampleCreate>

/** A moment written as an ISO date-time (what `datetime-local` inputs give, with a zone). */
export const IsoDateTime = z.pipe(
  z
    .string({ error: 'Give the date and time.' })
    .check(z.refine((text) => !Number.isNaN(Date.parse(text)), 'Give a real date and time.')),
  z.transform((text: string) => new Date(text).toISOString()),
)

export const CustodyEventCreate = z.strictObject({
  kind: z.enum(CUSTODY_KINDS, { error: 'Choose the kind of custody event.' }),
  from: trimmed(191, 'From'),
  to: trimmed(191, 'To'),
  at: IsoDateTime,
  purpose: z._default(optionalText(4000, 'Purpose'), null),
  condition: z._default(optionalText(4000, 'Condition'), null),
  location: z._default(optionalText(191, 'Location'), null),
  corrects: z._default(z.nullable(idOf('Name the event this one corrects.')), null),
})
export type CustodyEventCreate = z.output<typeof CustodyEventCreate>

export interface CustodyEvent {
  id: number
  sampleId: number
  kind: CustodyKind
  from: string
  to: string
  at: string
  purpose: string | null
  condition: string | null
  location: string | null
  corrects: number | null
  /** set when a later event corrects this one */
  correctedBy: number | null
  enteredBy: number
  enteredByName: string | null
  createdAt: string
}

export type CustodyFlag =
  | { kind: 'custody_gap'; eventId: number; expectedFrom: string; from: string }
  | { kind: 'sent_out'; eventId: number }
  | { kind: 'no_location' }

export interface Sample {
  id: number
  caseId: number
  itemId: string
  parentId: number | null
  description: string
  receivedFrom: string
  receivedOn: string
  collectedBy: string | null
  condition: string | null
  packaging: string | null
  storageLocation: string | null
  cutLocation: string | null
  orientation: string | null
  cutMethod: CutMethod | null
  clientVisible: boolean
  createdAt: string
}

export interface SampleDetail extends Sample {
  events: CustodyEvent[]
  flags: CustodyFlag[]
  /** ids of the legal holds that lock this item now (its own, its ancestors', the case's) */
  holdIds: number[]
}

/** What a client sees of an item marked for them. */
export type ClientSample = Pick<
  Sample,
  'id' | 'caseId' | 'itemId' | 'parentId' | 'description' | 'receivedOn' | 'condition'
>
