import { ref, watch, type Ref } from 'vue'
import {
  addSpecimen,
  confirmTensileRecord,
  invalidateTensileRecord,
  listSpecimens,
  recomputeTensileRecord,
  uploadTensileRecord,
  type SpecimenList,
} from '@/api/mechanical-tests'
import type { SpecimenCreate, TensileRecordView } from '../../shared/schemas/mechanical-tests'

/** A case's specimens and test records, and the lab's actions on them. */
export function useMechanicalTests(caseId: Ref<number>) {
  const list = ref<SpecimenList>({
    specimens: [],
    summary: { specimens: 0, properties: {} },
    conformity: null,
  })
  const loading = ref(false)

  async function load(): Promise<void> {
    if (!caseId.value) return
    loading.value = true
    try {
      list.value = await listSpecimens(caseId.value)
    } finally {
      loading.value = false
    }
  }
  watch(caseId, () => void load(), { immediate: true })

  const then = async <T>(work: Promise<T>): Promise<T> => {
    const answer = await work
    await load()
    return answer
  }

  return {
    list,
    loading,
    load,
    add: (specimen: Partial<SpecimenCreate>) => then(addSpecimen(caseId.value, specimen)),
    upload: (specimenId: number, file: File, options: Record<string, string>) =>
      then(uploadTensileRecord(caseId.value, specimenId, file, options)),
    recompute: (record: TensileRecordView, options: Record<string, string>) =>
      then(recomputeTensileRecord(caseId.value, record, options)),
    confirm: (record: TensileRecordView) => then(confirmTensileRecord(caseId.value, record)),
    invalidate: (record: TensileRecordView, reason: string, note: string | null) =>
      then(invalidateTensileRecord(caseId.value, record, reason, note, null)),
  }
}
