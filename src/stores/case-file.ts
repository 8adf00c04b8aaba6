import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { changeCaseStatus, fetchCase, isCaseDetail, updateCase, type CaseView } from '@/api/cases'
import { ApiError } from '@/api/client'
import { useSessionStore } from '@/stores/session'
import { can, type CaseAction } from '../../shared/access/policy'
import type { CaseDetail, CaseUpdate, ClientCaseView } from '../../shared/schemas/cases'
import type { CaseState } from '../../shared/workflow/case-states'

/**
 * The case open in the workspace, shared by its header and every section. The same policy the
 * server enforces decides which sections and buttons show.
 */
export const useCaseFileStore = defineStore('case-file', () => {
  const session = useSessionStore()
  const view = ref<CaseView>()
  const notFound = ref(false)
  const changingStatus = ref(false)

  const detail = computed<CaseDetail | undefined>(() =>
    view.value && isCaseDetail(view.value) ? view.value : undefined,
  )

  const clientView = computed<ClientCaseView | undefined>(() =>
    view.value && !isCaseDetail(view.value) ? view.value : undefined,
  )

  function allows(action: CaseAction): boolean {
    const user = session.user
    return !!user && !!detail.value && can(user, action, detail.value)
  }

  /** Loads the case; a 404 means "no such case or not yours to see". */
  async function load(id: number): Promise<void> {
    if (view.value?.id !== id) view.value = undefined
    notFound.value = false
    try {
      view.value = await fetchCase(id)
    } catch (error) {
      view.value = undefined
      if (error instanceof ApiError && error.status === 404) notFound.value = true
      else throw error
    }
  }

  /** Saves a change made against the version shown; a conflict is left to the form to show. */
  async function save(change: CaseUpdate): Promise<CaseDetail> {
    if (!view.value) throw new Error('no case is open')
    const saved = await updateCase(view.value.id, change)
    view.value = saved
    return saved
  }

  /** Shows the record as it is now, e.g. after a conflict told us someone else saved it. */
  function adopt(current: CaseDetail): void {
    view.value = current
  }

  async function moveTo(status: CaseState): Promise<void> {
    if (!view.value) return
    changingStatus.value = true
    try {
      view.value = await changeCaseStatus(view.value.id, status)
    } finally {
      changingStatus.value = false
    }
  }

  function $reset(): void {
    view.value = undefined
    notFound.value = false
    changingStatus.value = false
  }

  return {
    view,
    detail,
    clientView,
    notFound,
    changingStatus,
    allows,
    load,
    save,
    adopt,
    moveTo,
    $reset,
  }
})
