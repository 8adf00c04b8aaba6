import { ref, watch, type Ref } from 'vue'
import {
  fetchNoticePeriod,
  listNotices,
  listSamples,
  recordAnswer,
  recordNotice,
  resolveObjection,
  saveNoticePeriod,
} from '@/api/evidence'
import type { Notice, NoticeAnswerCreate, NoticeCreate } from '../../shared/schemas/notices'
import type { Sample } from '../../shared/schemas/samples'

/** The case's notices before destructive work, their answers and the notice period. */
export function useNotices(caseId: Ref<number>) {
  const notices = ref<Notice[]>([])
  const samples = ref<Sample[]>([])
  const periodDays = ref<number>()

  async function load(): Promise<void> {
    if (!caseId.value) return
    ;[notices.value, samples.value, periodDays.value] = await Promise.all([
      listNotices(caseId.value),
      listSamples(caseId.value),
      fetchNoticePeriod(caseId.value),
    ])
  }
  watch(caseId, () => void load(), { immediate: true })

  const replace = (notice: Notice) => {
    notices.value = notices.value.map((n) => (n.id === notice.id ? notice : n))
  }

  async function create(input: NoticeCreate) {
    notices.value = [...notices.value, await recordNotice(caseId.value, input)]
  }
  async function answer(noticeId: number, input: NoticeAnswerCreate) {
    replace(await recordAnswer(caseId.value, noticeId, input))
  }
  async function resolve(noticeId: number, answerId: number, resolution: string) {
    replace(await resolveObjection(caseId.value, noticeId, answerId, resolution))
  }
  async function setPeriod(days: number) {
    periodDays.value = await saveNoticePeriod(caseId.value, days)
  }

  return { notices, samples, periodDays, load, create, answer, resolve, setPeriod }
}
