import { ref, watch, type Ref } from 'vue'
import { acknowledgeReport, answerQuestion, askQuestion, fetchReport } from '@/api/reports'
import type { ReportView } from '../../shared/schemas/reports'

/** One revision open in a reader, with the reader's own steps on it. */
export function useReport(reportId: Ref<number | undefined>) {
  const report = ref<ReportView>()

  async function load(): Promise<void> {
    report.value = reportId.value ? await fetchReport(reportId.value) : undefined
  }
  watch(reportId, () => void load(), { immediate: true })

  const withReport = (action: (id: number) => Promise<unknown>) => async () => {
    if (!reportId.value) return
    await action(reportId.value)
    await load()
  }

  return {
    report,
    load,
    acknowledge: withReport(acknowledgeReport),
    ask: (body: string) => withReport((id) => askQuestion(id, body))(),
    answer: (questionId: number, body: string) =>
      withReport((id) => answerQuestion(id, questionId, body))(),
  }
}
