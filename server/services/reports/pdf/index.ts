export type { ReportPdfInput, PersonOnReport } from './input'
export { renderReportPdf } from './render'
export { DRAFT_WATERMARK } from './page-frame'
export { renderReportPdfOffThread } from './off-thread'
