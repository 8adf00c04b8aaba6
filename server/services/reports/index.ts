import type { FileStorage } from '../../storage/file-storage'
import type { ServiceContext } from '../context'
import type { PhotoService } from '../photos/photos'
import type { ReportPdfInput } from './pdf'
import { amendReport } from './amend'
import { issueReport } from './issue'
import { acknowledge, answerQuestion, askQuestion, questionThread } from './questions'
import { createReportReading } from './reading'

export { caseOfReport } from './report-rows'

export function createReportService(deps: {
  storage: FileStorage
  photos: PhotoService
  renderPdf: (input: ReportPdfInput) => Promise<Buffer>
  clock?: () => Date
}) {
  const clock = deps.clock ?? (() => new Date())
  const reading = createReportReading(deps.storage)
  return {
    ...reading,
    issue: (ctx: ServiceContext, caseId: number) => issueReport(ctx, { ...deps, clock }, caseId),
    amend: amendReport,
    acknowledge,
    askQuestion,
    answerQuestion,
    questions: (ctx: ServiceContext, reportId: number) => questionThread(ctx.db, reportId),
  }
}

export type ReportService = ReturnType<typeof createReportService>
