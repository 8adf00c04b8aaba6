import { computed, ref, watch, type Ref } from 'vue'
import { addCustodyEvent, fetchSample, listSamples, placeHold, receiveSample } from '@/api/evidence'
import type {
  CustodyEventCreate,
  Sample,
  SampleCreate,
  SampleDetail,
} from '../../shared/schemas/samples'

/** One item's page: the item with its history, the pieces cut from it, and what is done to it. */
export function useSample(caseId: Ref<number>, sampleId: Ref<number>) {
  const sample = ref<SampleDetail>()
  const all = ref<Sample[]>([])

  async function load(): Promise<void> {
    if (!caseId.value) return
    ;[sample.value, all.value] = await Promise.all([
      fetchSample(caseId.value, sampleId.value),
      listSamples(caseId.value),
    ])
  }
  watch([caseId, sampleId], () => void load(), { immediate: true })

  const pieces = computed(() => all.value.filter((s) => s.parentId === sampleId.value))
  const parent = computed(() => all.value.find((s) => s.id === sample.value?.parentId))

  async function record(event: CustodyEventCreate) {
    sample.value = await addCustodyEvent(caseId.value, sampleId.value, event)
  }
  async function cut(fields: SampleCreate) {
    await receiveSample(caseId.value, fields)
    await load()
  }
  async function hold(reason: string) {
    await placeHold(caseId.value, { sampleId: sampleId.value, reason })
    await load()
  }

  return { sample, pieces, parent, load, record, cut, hold }
}
