import { ref, watch, type Ref } from 'vue'
import {
  listObservations,
  listSamples,
  recordObservation,
  withdrawObservation,
} from '@/api/evidence'
import { listPhotos } from '@/api/photos'
import type { Observation, ObservationCreate } from '../../shared/schemas/observations'
import type { Photo } from '../../shared/schemas/photos'
import type { Sample } from '../../shared/schemas/samples'

/** The case's observations register and the items and photos an observation may point to. */
export function useObservations(caseId: Ref<number>) {
  const observations = ref<Observation[]>([])
  const samples = ref<Sample[]>([])
  const photos = ref<Photo[]>([])

  async function load(): Promise<void> {
    if (!caseId.value) return
    ;[observations.value, samples.value, photos.value] = await Promise.all([
      listObservations(caseId.value),
      listSamples(caseId.value),
      listPhotos(caseId.value),
    ])
  }
  watch(caseId, () => void load(), { immediate: true })

  async function record(input: ObservationCreate) {
    await recordObservation(caseId.value, input)
    await load()
  }
  async function withdraw(observationId: number, reason: string) {
    await withdrawObservation(caseId.value, observationId, reason)
    await load()
  }

  return { observations, samples, photos, load, record, withdraw }
}
