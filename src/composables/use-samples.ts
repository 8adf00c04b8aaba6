import { computed, ref, watch, type Ref } from 'vue'
import { listHolds, listSamples, placeHold, receiveSample, releaseHold } from '@/api/evidence'
import type { HoldCreate, LegalHold } from '../../shared/schemas/holds'
import type { Sample, SampleCreate } from '../../shared/schemas/samples'

export interface SampleRowView extends Sample {
  /** how many cuts away from an item as received */
  depth: number
}

/** Items in tree order: each followed by the pieces cut from it. */
export function treeOrder(samples: readonly Sample[]): SampleRowView[] {
  const children = new Map<number | null, Sample[]>()
  for (const sample of samples) {
    const key = samples.some((s) => s.id === sample.parentId) ? sample.parentId : null
    children.set(key, [...(children.get(key) ?? []), sample])
  }
  const rows: SampleRowView[] = []
  const visit = (parentId: number | null, depth: number) => {
    for (const sample of children.get(parentId) ?? []) {
      rows.push({ ...sample, depth })
      visit(sample.id, depth + 1)
    }
  }
  visit(null, 0)
  return rows
}

/** The case's items and holds, and the changes to them made from the samples page. */
export function useSamples(caseId: Ref<number>) {
  const samples = ref<Sample[]>([])
  const holds = ref<LegalHold[]>([])
  const loading = ref(false)

  async function load(): Promise<void> {
    if (!caseId.value) return
    loading.value = true
    try {
      ;[samples.value, holds.value] = await Promise.all([
        listSamples(caseId.value),
        listHolds(caseId.value),
      ])
    } finally {
      loading.value = false
    }
  }
  watch(caseId, () => void load(), { immediate: true })

  const rows = computed(() => treeOrder(samples.value))
  const activeHolds = computed(() => holds.value.filter((hold) => hold.releasedAt === null))

  async function receive(sample: SampleCreate) {
    const created = await receiveSample(caseId.value, sample)
    await load()
    return created
  }
  async function hold(input: HoldCreate) {
    await placeHold(caseId.value, input)
    await load()
  }
  async function release(holdId: number, reason: string) {
    await releaseHold(caseId.value, holdId, reason)
    await load()
  }

  return { samples, holds, rows, activeHolds, loading, load, receive, hold, release }
}
