import { reactive } from 'vue'

/** The options the upload page offers, as the engine's contract names them. */
export const OFFERED_OPTIONS = [
  'forceColumn',
  'extensionColumn',
  'strainColumn',
  'stressColumn',
  'diameter',
  'width',
  'thickness',
  'gaugeLength',
  'fitRange',
  'offset',
  'uncertainty',
  'uncertaintySource',
] as const
export type OfferedOption = (typeof OFFERED_OPTIONS)[number]

/** A form of option texts; empty ones are left out, so the engine decides them itself. */
export function useRecordOptions(initial: Record<string, string> = {}) {
  const values = reactive(
    Object.fromEntries(OFFERED_OPTIONS.map((name) => [name, initial[name] ?? ''])) as Record<
      OfferedOption,
      string
    >,
  )
  const current = (): Record<string, string> => {
    const kept = Object.entries(values).filter(([, value]) => value.trim() !== '')
    return { ...initial, ...Object.fromEntries(kept.map(([k, v]) => [k, v.trim()])) }
  }
  return { values, current }
}
