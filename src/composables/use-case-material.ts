import { computed, shallowRef, watch } from 'vue'
import { getSpecification } from '@/api/specifications'
import { useCaseFileStore } from '@/stores/case-file'
import type { Specification } from '../../shared/schemas/specifications'
import type { CaseMaterial } from '../../shared/specifications/case-conformity'
import { caseMaterialOf } from '../../shared/specifications/case-material'

/** The open case's linked record and band, for judging a preview as the server will. */
export function useCaseMaterial() {
  const caseFile = useCaseFileStore()
  const record = shallowRef<Specification | null>(null)
  watch(
    () => caseFile.detail?.specificationId ?? null,
    async (id) => {
      record.value = id === null ? null : await getSpecification(id)
    },
    { immediate: true },
  )
  return computed<CaseMaterial | null>(() => {
    const detail = caseFile.detail
    if (!detail) return null
    const linked = record.value?.id === detail.specificationId ? record.value : null
    return caseMaterialOf(linked, detail)
  })
}
