import { analyseRecord } from './analyze'
import { evaluateConformity, type ConformityResult } from './conformity'
import { TensileInputError } from './errors'
import { checkTensileOptions, type TensileOptions } from './options'
import { resolveOptions, type ResolvedOptions } from './resolve-options'
import type { TensileResult } from './result'
import { summariseSpecimens, type SpecimenSummary } from './statistics'
import type { RecordSource } from './types'

/** One specimen's record: a name (the file's, as given) and its text, whole or in chunks. */
export interface SpecimenRecord {
  name: string
  source: RecordSource
}

/** One specimen's result: every property, and the conformity statement when a specification was named. */
export type SpecimenResult = TensileResult & { file: string; conformity: ConformityResult | null }

export interface SetSummary {
  summary: { specimens: number; properties: SpecimenSummary }
}

/**
 * The engine's answer, exactly as the command line prints it with --json: one specimen's
 * result, or, for several, their results followed by `{ summary }`.
 */
export type TensileReport = SpecimenResult | [...SpecimenResult[], SetSummary]

function analyseSpecimen(specimen: SpecimenRecord, resolved: ResolvedOptions): SpecimenResult {
  try {
    const result = analyseRecord(specimen.source, resolved.analysis)
    const spec = resolved.specification
    return {
      file: specimen.name,
      ...result,
      conformity: spec === null ? null : evaluateConformity(result, spec, resolved.basis),
    }
  } catch (error) {
    if (error instanceof TensileInputError)
      throw new TensileInputError(`${specimen.name}: ${error.message}`)
    throw error
  }
}

/**
 * The whole pipeline, the one call the command line and the server make: check the options
 * against the shared schema, analyse each record, compare it with the specification, and
 * summarise a set. Records are read one after the other, so only one is held at a time.
 */
export function analyseSpecimens(
  specimens: readonly SpecimenRecord[],
  options: TensileOptions,
): TensileReport {
  if (specimens.length === 0) throw new TensileInputError('No record to analyse')
  const resolved = resolveOptions(checkTensileOptions(options))
  const results = specimens.map((specimen) => analyseSpecimen(specimen, resolved))
  if (results.length === 1) return results[0]!
  const summary = { specimens: results.length, properties: summariseSpecimens(results) }
  return [...results, { summary }]
}

/** The specimen results of a report, without the summary. */
export function specimenResults(report: TensileReport): SpecimenResult[] {
  if (!Array.isArray(report)) return [report]
  return report.filter((entry): entry is SpecimenResult => !('summary' in entry))
}

/** The summary of a report over several specimens, or null for one. */
export function reportSummary(report: TensileReport): SetSummary['summary'] | null {
  if (!Array.isArray(report)) return null
  const last = report.at(-1)
  return last !== undefined && 'summary' in last ? last.summary : null
}
