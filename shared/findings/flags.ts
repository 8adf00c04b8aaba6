import { blocksOf } from './check-document'
import type { FindingsDocument } from './document'
import { danglingFigureRefs } from './figures'
import { OPINION_SECTIONS, SECTION_TITLES, type SectionKey } from './sections'

export type FindingsFlagKind =
  | 'opinion_uncited'
  | 'opinion_outside_reasoning'
  | 'opinion_cites_withdrawn'
  | 'figure_reference_dangling'

export interface FindingsFlag {
  kind: FindingsFlagKind
  /** which opinion (1 for the first in the text), or the figure id of a dangling reference */
  subject: string
  message: string
}

interface OpinionPlace {
  index: number
  section: SectionKey | null
  observations: number[]
}

/** Each opinion with the template section it stands in (the last section heading above it). */
export function opinionsOf(doc: FindingsDocument): OpinionPlace[] {
  const opinions: OpinionPlace[] = []
  let section: SectionKey | null = null
  for (const block of blocksOf(doc)) {
    if (block.type === 'heading' && block.attrs.section) section = block.attrs.section
    if (block.type === 'opinion')
      opinions.push({ index: opinions.length + 1, section, observations: block.attrs.observations })
  }
  return opinions
}

/**
 * What the author (and later the reviewer) should look at before the draft goes on: opinions that
 * cite no observation, opinions among the facts, citations of withdrawn observations, and figure
 * references whose figure is gone.
 */
export function findingsFlags(
  doc: FindingsDocument,
  withdrawnObservations: ReadonlySet<number> = new Set(),
): FindingsFlag[] {
  const flags: FindingsFlag[] = []
  for (const opinion of opinionsOf(doc)) {
    const subject = String(opinion.index)
    if (opinion.observations.length === 0)
      flags.push({
        kind: 'opinion_uncited',
        subject,
        message: `Opinion ${subject} cites no observation: say which observed facts it rests on.`,
      })
    if (!opinion.section || !OPINION_SECTIONS.includes(opinion.section))
      flags.push({
        kind: 'opinion_outside_reasoning',
        subject,
        message: `Opinion ${subject} stands in ${opinion.section ? SECTION_TITLES[opinion.section] : 'no section'}: opinions belong in the discussion, conclusions or recommendations.`,
      })
    const withdrawn = opinion.observations.filter((n) => withdrawnObservations.has(n))
    if (withdrawn.length)
      flags.push({
        kind: 'opinion_cites_withdrawn',
        subject,
        message: `Opinion ${subject} cites withdrawn ${withdrawn.map((n) => `O-${n}`).join(', ')}.`,
      })
  }
  for (const figureId of danglingFigureRefs(doc))
    flags.push({
      kind: 'figure_reference_dangling',
      subject: figureId,
      message: 'A figure reference points to a figure that is no longer in the draft.',
    })
  return flags
}
