import { inject, type InjectionKey, type Ref } from 'vue'
import type { LiveBlockSnapshots } from '../../../shared/findings/live-blocks'
import type { Observation } from '../../../shared/schemas/observations'
import type { Photo } from '../../../shared/schemas/photos'

/** The case's data the draft's nodes show: provided by the findings view. */
export interface FindingsCaseData {
  liveBlocks: Ref<LiveBlockSnapshots>
  observations: Ref<Observation[]>
  photos: Ref<Photo[]>
}

export interface FigureEntry {
  figureId: string
  number: number
  caption: string
  photoId: number
}

/** The figures of one editor, numbered in the order of the text; provided by each editor. */
export interface FindingsFigures {
  numbers: Ref<Map<string, number>>
  list: Ref<FigureEntry[]>
}

export const CASE_DATA: InjectionKey<FindingsCaseData> = Symbol('findings-case-data')
export const FIGURES: InjectionKey<FindingsFigures> = Symbol('findings-figures')

export function useCaseData(): FindingsCaseData {
  const data = inject(CASE_DATA)
  if (!data) throw new Error('the findings view provides the case data')
  return data
}

export function useFigures(): FindingsFigures {
  const figures = inject(FIGURES)
  if (!figures) throw new Error('the findings editor provides its figures')
  return figures
}

/** `O-12` → 12, the number an opinion cites. */
export const observationNumberOf = (observation: Observation) =>
  Number(observation.number.replace(/^O-/, ''))
