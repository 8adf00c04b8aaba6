import { computed, onBeforeUnmount, ref, watch } from 'vue'
import { useRoute, useRouter, type LocationQuery } from 'vue-router'
import { listCases, type CaseListFilter, type CaseListItem } from '@/api/cases'
import { isSessionProblem } from '@/api/client'
import { MECHANISMS, type Mechanism } from '../../shared/schemas/case-vocabulary'
import { CASE_SORTS, type CaseSort } from '../../shared/schemas/cases'
import {
  CASE_STATES,
  CLIENT_STAGES,
  type CaseState,
  type ClientStage,
} from '../../shared/workflow/case-states'

export const CASES_PER_PAGE = 25
const SEARCH_PAUSE_MS = 300

function text(query: LocationQuery, key: string): string | undefined {
  const value = query[key]
  return typeof value === 'string' && value !== '' ? value : undefined
}

function wholeNumber(query: LocationQuery, key: string): number | null {
  const value = text(query, key)
  return value && /^[1-9]\d{0,8}$/.test(value) ? Number(value) : null
}

function oneOf<T extends string>(query: LocationQuery, key: string, values: readonly T[]) {
  const value = text(query, key)
  return values.find((candidate) => candidate === value) ?? null
}

/** The list's filters as the address holds them. */
function filtersFrom(query: LocationQuery) {
  return {
    status: oneOf<CaseState>(query, 'status', CASE_STATES),
    // clients filter by the plain stages they are shown, staff by the working states
    stage: oneOf<ClientStage>(query, 'stage', CLIENT_STAGES),
    organisationId: wholeNumber(query, 'organisationId'),
    investigatorId: wholeNumber(query, 'investigatorId'),
    overdue: text(query, 'overdue') === 'true',
    safetyCritical: text(query, 'safetyCritical') === 'true',
    material: text(query, 'material') ?? '',
    mechanism: oneOf<Mechanism>(query, 'mechanism', MECHANISMS),
    sort: oneOf<CaseSort>(query, 'sort', CASE_SORTS) ?? 'createdAt',
    order: oneOf(query, 'order', ['asc', 'desc'] as const) ?? 'desc',
  }
}
export type CaseListFilters = ReturnType<typeof filtersFrom>

/** The address's query for a filter: empty filters and the default order are left out. */
function toQuery(filter: CaseListFilter): Record<string, string | undefined> {
  const entries = Object.entries(filter).map(([key, value]) => [key, value?.toString()])
  const query = Object.fromEntries(entries) as Record<string, string | undefined>
  query.pageSize = undefined
  if (query.page === '1') query.page = undefined
  if (filter.sort === 'createdAt' && filter.order === 'desc') {
    query.sort = undefined
    query.order = undefined
  }
  return query
}

/**
 * One page of the case list, fetched from the server by page, filters, search and sort.
 * Everything lives in the address too, so coming back from a case shows the same page.
 */
export function useCaseList() {
  const route = useRoute()
  const router = useRouter()

  const page = ref(wholeNumber(route.query, 'page') ?? 1)
  const filters = ref(filtersFrom(route.query))
  const search = ref(text(route.query, 'q') ?? '')
  const appliedSearch = ref(search.value.trim())
  const appliedMaterial = ref(filters.value.material.trim())

  const cases = ref<CaseListItem[]>([])
  const total = ref(0)
  const loading = ref(false)
  const loadError = ref('')

  let pauseTimer: ReturnType<typeof setTimeout> | undefined
  watch([search, () => filters.value.material], ([searchText, material]) => {
    clearTimeout(pauseTimer)
    pauseTimer = setTimeout(() => {
      appliedSearch.value = searchText.trim()
      appliedMaterial.value = material.trim()
      page.value = 1
    }, SEARCH_PAUSE_MS)
  })
  onBeforeUnmount(() => clearTimeout(pauseTimer))
  watch(
    () => [
      filters.value.status,
      filters.value.stage,
      filters.value.organisationId,
      filters.value.investigatorId,
    ],
    () => (page.value = 1),
  )
  watch(
    () => [
      filters.value.overdue,
      filters.value.safetyCritical,
      filters.value.mechanism,
      filters.value.sort,
      filters.value.order,
    ],
    () => (page.value = 1),
  )

  const filter = computed<CaseListFilter>(() => ({
    page: page.value,
    pageSize: CASES_PER_PAGE,
    status: filters.value.status ?? undefined,
    stage: filters.value.stage ?? undefined,
    organisationId: filters.value.organisationId ?? undefined,
    investigatorId: filters.value.investigatorId ?? undefined,
    overdue: filters.value.overdue || undefined,
    safetyCritical: filters.value.safetyCritical || undefined,
    material: appliedMaterial.value || undefined,
    mechanism: filters.value.mechanism ?? undefined,
    q: appliedSearch.value || undefined,
    sort: filters.value.sort,
    order: filters.value.order,
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
    (current) => {
      void router.replace({ query: toQuery(current) })
      void load()
    },
    { immediate: true },
  )

  return { page, filters, search, cases, total, loading, loadError, load }
}
