import { computed, onBeforeUnmount, ref, watch } from 'vue'
import { useRoute, useRouter, type LocationQuery } from 'vue-router'
import { isSessionProblem } from '@/api/client'
import { listCases, type CaseListFilter, type CaseListItem } from '@/api/cases'
import {
  CASE_STATES,
  CLIENT_STAGES,
  type CaseState,
  type ClientStage,
} from '../../shared/workflow/case-states'

export const CASES_PER_PAGE = 25
const SEARCH_PAUSE_MS = 300

function queryText(query: LocationQuery, key: string): string | undefined {
  const value = query[key]
  return typeof value === 'string' && value !== '' ? value : undefined
}

function queryNumber(query: LocationQuery, key: string): number | undefined {
  const value = Number(queryText(query, key))
  return Number.isInteger(value) && value > 0 ? value : undefined
}

function queryState(query: LocationQuery): CaseState | undefined {
  const value = queryText(query, 'status')
  return CASE_STATES.find((state) => state === value)
}

function queryStage(query: LocationQuery): ClientStage | undefined {
  const value = queryText(query, 'stage')
  return CLIENT_STAGES.find((stage) => stage === value)
}

/**
 * One page of the case list, fetched from the server by page, status, organisation and search.
 * The filters live in the address too, so coming back from a case shows the same page.
 */
export function useCaseList() {
  const route = useRoute()
  const router = useRouter()

  const page = ref(queryNumber(route.query, 'page') ?? 1)
  const status = ref<CaseState | null>(queryState(route.query) ?? null)
  // clients filter by the plain stages they are shown, staff by the working states
  const stage = ref<ClientStage | null>(queryStage(route.query) ?? null)
  const organisationId = ref<number | null>(queryNumber(route.query, 'organisationId') ?? null)
  const search = ref(queryText(route.query, 'q') ?? '')
  const appliedSearch = ref(search.value.trim())

  const cases = ref<CaseListItem[]>([])
  const total = ref(0)
  const loading = ref(false)
  const loadError = ref('')

  let searchTimer: ReturnType<typeof setTimeout> | undefined
  watch(search, (text) => {
    clearTimeout(searchTimer)
    searchTimer = setTimeout(() => {
      appliedSearch.value = text.trim()
      page.value = 1
    }, SEARCH_PAUSE_MS)
  })
  onBeforeUnmount(() => clearTimeout(searchTimer))
  watch([status, stage, organisationId], () => {
    page.value = 1
  })

  const filter = computed<CaseListFilter>(() => ({
    page: page.value,
    pageSize: CASES_PER_PAGE,
    status: status.value ?? undefined,
    stage: stage.value ?? undefined,
    organisationId: organisationId.value ?? undefined,
    q: appliedSearch.value || undefined,
  }))

  // Only the answer to the newest request is shown, however the answers arrive.
  let latestRequest = 0
  async function load(): Promise<void> {
    const thisRequest = ++latestRequest
    loading.value = true
    loadError.value = ''
    try {
      const result = await listCases(filter.value)
      if (thisRequest !== latestRequest) return
      cases.value = result.cases
      total.value = result.page.total
    } catch (error) {
      if (thisRequest !== latestRequest || isSessionProblem(error)) return
      loadError.value = error instanceof Error ? error.message : String(error)
    } finally {
      if (thisRequest === latestRequest) loading.value = false
    }
  }

  watch(
    filter,
    ({ page: pageNumber, status: state, stage: clientStage, organisationId: organisation, q }) => {
      const query = {
        page: pageNumber > 1 ? String(pageNumber) : undefined,
        status: state,
        stage: clientStage,
        q,
      }
      void router.replace({ query: { ...query, organisationId: organisation?.toString() } })
      void load()
    },
    { immediate: true },
  )

  return { page, status, stage, organisationId, search, cases, total, loading, loadError, load }
}
