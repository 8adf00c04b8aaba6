import { ref, watch, type Ref } from 'vue'
import { changeCaseStatus, fetchCase, type CaseWithNextStates } from '@/api/cases'
import { ApiError } from '@/api/client'
import type { CaseState } from '../../shared/workflow/case-states'

/**
 * One case for its page. A 404 means "no such case or not yours to see": the page then shows the
 * same not-found content as an unknown address.
 */
export function useCase(id: Ref<number>) {
  const caseFile = ref<CaseWithNextStates>()
  const notFound = ref(false)
  const loading = ref(false)
  const changingStatus = ref(false)

  async function load(): Promise<void> {
    loading.value = true
    notFound.value = false
    try {
      caseFile.value = await fetchCase(id.value)
    } catch (error) {
      caseFile.value = undefined
      if (error instanceof ApiError && error.status === 404) notFound.value = true
      else throw error
    } finally {
      loading.value = false
    }
  }

  async function moveTo(status: CaseState): Promise<void> {
    changingStatus.value = true
    try {
      caseFile.value = await changeCaseStatus(id.value, status)
    } finally {
      changingStatus.value = false
    }
  }

  // A failed load is left unhandled on purpose: the app turns it into a toast.
  watch(
    id,
    () => {
      void load()
    },
    { immediate: true },
  )

  return { caseFile, notFound, loading, changingStatus, load, moveTo }
}
