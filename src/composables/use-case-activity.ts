import { ref, watch, type Ref } from 'vue'
import { fetchActivity } from '@/api/cases'
import type { ActivityEntry, ActivityKind } from '../../shared/schemas/activity'

export const ACTIVITY_PER_PAGE = 25

/** One page of a case's activity, filtered by person and kind, refetched when a filter moves. */
export function useCaseActivity(caseId: Ref<number>, refreshKey: Ref<unknown>) {
  const page = ref(1)
  const actorId = ref<number | null>(null)
  const kind = ref<ActivityKind | null>(null)
  const entries = ref<ActivityEntry[]>([])
  const total = ref(0)
  const loading = ref(false)

  let latest = 0
  async function load(): Promise<void> {
    const mine = ++latest
    loading.value = true
    try {
      const { data, page: answered } = await fetchActivity(caseId.value, {
        page: page.value,
        pageSize: ACTIVITY_PER_PAGE,
        actorId: actorId.value ?? undefined,
        kind: kind.value ?? undefined,
      })
      if (mine !== latest) return
      entries.value = data
      total.value = answered.total
    } finally {
      if (mine === latest) loading.value = false
    }
  }

  watch([actorId, kind], () => {
    page.value = 1
  })
  watch([caseId, page, actorId, kind, refreshKey], () => void load(), { immediate: true })

  return { page, actorId, kind, entries, total, loading }
}
