import { z } from 'zod/mini'
import { trimmed } from './common'

export const MAX_ADDRESS_LINES = 6

/** The laboratory's name and postal address, as every report's title page prints them. */
export const LaboratorySettingsUpdate = z.strictObject({
  name: trimmed(191, 'Laboratory name'),
  addressLines: z
    .array(trimmed(120, 'Each address line'), { error: 'Give the address as a list of lines.' })
    .check(
      z.minLength(1, 'Give at least one line of the address.'),
      z.maxLength(MAX_ADDRESS_LINES, `The address has at most ${MAX_ADDRESS_LINES} lines.`),
    ),
})
export type LaboratorySettingsUpdate = z.output<typeof LaboratorySettingsUpdate>

export interface LaboratorySettings {
  name: string
  addressLines: string[]
  /** null while the settings have never been saved (the name is then a placeholder) */
  updatedAt: string | null
}

export const UNNAMED_LABORATORY = 'Laboratory name not set'
