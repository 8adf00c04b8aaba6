import { z } from 'zod/mini'
import { IsoDate, optionalText } from './common'

export const SERVICE_EVENT_KINDS = [
  'manufacture',
  'installation',
  'inspection',
  'repair',
  'modification',
  'incident',
  'environment_change',
  'failure',
  'other',
] as const
export type ServiceEventKind = (typeof SERVICE_EVENT_KINDS)[number]

export const SERVICE_EVENT_KIND_LABELS: Record<ServiceEventKind, string> = {
  manufacture: 'Manufacture',
  installation: 'Installation',
  inspection: 'Inspection',
  repair: 'Repair',
  modification: 'Modification',
  incident: 'Incident',
  environment_change: 'Change of environment',
  failure: 'Failure',
  other: 'Other',
}

const reading = (label: string, max: number) =>
  z.nullable(
    z
      .number({ error: `${label} must be a number.` })
      .check(
        z.minimum(0, `${label} cannot be negative.`),
        z.maximum(max, `${label} is at most ${max}.`),
      ),
  )

/** The fields of a dated event in the part's life; running totals are meter readings. */
const eventFields = {
  kind: z.enum(SERVICE_EVENT_KINDS, { error: 'Choose the kind of event.' }),
  occurredOn: IsoDate,
  description: z
    .string({ error: 'Describe the event.' })
    .check(
      z.trim(),
      z.minLength(1, 'Describe the event.'),
      z.maxLength(4000, 'The description is at most 4000 characters.'),
    ),
  /** operating hours on the meter at the event */
  hours: reading('Hours', 10_000_000),
  /** load cycles counted up to the event */
  cycles: z.nullable(
    z
      .int({ error: 'Cycles must be a whole number.' })
      .check(z.minimum(0, 'Cycles cannot be negative.'), z.maximum(Number.MAX_SAFE_INTEGER)),
  ),
  temperatureC: z.nullable(
    z
      .number({ error: 'Temperature must be a number.' })
      .check(
        z.minimum(-273.15, 'No temperature is below absolute zero.'),
        z.maximum(5000, 'Temperature is at most 5000 °C.'),
      ),
  ),
  environment: optionalText(191, 'Environment'),
  load: optionalText(191, 'Load'),
  source: optionalText(191, 'Source'),
  clientVisible: z.boolean({ error: 'Say whether the client may see this event.' }),
}

export const ServiceEventCreate = z.strictObject({
  kind: eventFields.kind,
  occurredOn: eventFields.occurredOn,
  description: eventFields.description,
  hours: z._default(eventFields.hours, null),
  cycles: z._default(eventFields.cycles, null),
  temperatureC: z._default(eventFields.temperatureC, null),
  environment: z._default(eventFields.environment, null),
  load: z._default(eventFields.load, null),
  source: z._default(eventFields.source, null),
  clientVisible: z._default(eventFields.clientVisible, false),
})
export type ServiceEventCreate = z.output<typeof ServiceEventCreate>
export type ServiceEventFields = ServiceEventCreate

export const ServiceEventUpdate = z.strictObject({
  ...z.partial(z.strictObject(eventFields)).shape,
  version: z.int({ error: 'Send the version of the event you edited.' }).check(z.positive()),
})
export type ServiceEventUpdate = z.output<typeof ServiceEventUpdate>

export const ServiceEventDelete = z.strictObject({
  version: z.int({ error: 'Send the version of the event you remove.' }).check(z.positive()),
})

export interface AttachmentInfo {
  id: number
  fileName: string
  mediaType: string
  size: number
  sha256: string
  createdAt: string
}

export interface ServiceEvent extends ServiceEventFields {
  id: number
  caseId: number
  version: number
  attachments: AttachmentInfo[]
  createdAt: string
  updatedAt: string
}

/** File types accepted as service-history documents, recognised by their content. */
export const DOCUMENT_MEDIA_TYPES = [
  'application/pdf',
  'image/png',
  'image/jpeg',
  'image/tiff',
  'image/webp',
] as const

export const MAX_ATTACHMENT_BYTES = 25 * 1024 * 1024
