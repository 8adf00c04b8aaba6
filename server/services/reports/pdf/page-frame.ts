import type { DynamicContent, Watermark } from 'pdfmake/interfaces'
import type { ReportPdfInput } from './input'
import { INK, PAGE } from './styles'
import { reportLabel } from './title-page'
import { runs } from './text-runs'

export const DRAFT_WATERMARK = 'Draft — not issued'

const [left, , right] = PAGE.margins

/** Every page: the laboratory and the report's number and revision, over a thin rule. */
export function header(input: ReportPdfInput): DynamicContent {
  return () => ({
    margin: [left, 34, right, 0],
    stack: [
      {
        columns: [
          { text: runs(input.laboratory.name), style: 'running' },
          {
            text: runs(reportLabel(input.report)),
            style: 'running',
            alignment: 'right',
            bold: true,
          },
        ],
      },
      {
        canvas: [
          {
            type: 'line',
            x1: 0,
            y1: 4,
            x2: PAGE.width - left - right,
            y2: 4,
            lineWidth: 0.5,
            lineColor: INK.rule,
          },
        ],
      },
    ],
  })
}

/** Every page: the case, and "Page x of y" with the real total. */
export function footer(input: ReportPdfInput): DynamicContent {
  return (currentPage, pageCount) => ({
    margin: [left, 28, right, 0],
    columns: [
      { text: runs(`Case ${input.case.number}`), style: 'running' },
      { text: runs(`Page ${currentPage} of ${pageCount}`), style: 'running', alignment: 'right' },
    ],
  })
}

export function watermark(input: ReportPdfInput): Watermark | undefined {
  if (!input.report.draft) return undefined
  return {
    text: DRAFT_WATERMARK,
    font: 'Text',
    color: INK.draft,
    opacity: 0.2,
    bold: true,
    fontSize: 54,
  }
}
