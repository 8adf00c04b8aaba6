import type { Content, TableCell } from 'pdfmake/interfaces'
import type { PersonOnReport, ReportPdfInput } from './input'
import { CONTENT_WIDTH, INK } from './styles'
import { runs } from './text-runs'

const dash = '—'
const orDash = (value: string | null | undefined) => (value ? value : dash)

function period(from: string | null, to: string | null): string {
  if (!from && !to) return dash
  if (!from || !to || from === to) return (from ?? to) as string
  return `${from} to ${to}`
}

/** "Report FL-2026-0007-R, revision A", or the draft's own words. */
export function reportLabel(report: ReportPdfInput['report']): string {
  return report.draft
    ? `Report ${report.number} · draft, not issued`
    : `Report ${report.number} · Revision ${report.revision}`
}

function fieldRows(input: ReportPdfInput): TableCell[][] {
  const fields: [string, string][] = [
    ['Client', input.case.clientName],
    ['Client reference', orDash(input.case.clientReference)],
    ['Case', input.case.number],
    ['Component', input.case.component],
    ['Material as specified', input.case.material],
    ['Items received', orDash(input.dates.itemsReceived)],
    ['Examinations and tests performed', period(input.dates.testsFrom, input.dates.testsTo)],
    [
      'Report issued',
      input.report.draft ? 'Not issued (draft preview)' : orDash(input.dates.issued),
    ],
  ]
  return fields.map(([label, value]) => [
    { text: runs(label), style: 'label' },
    { text: runs(value) },
  ])
}

function peopleRows(people: ReportPdfInput['people']): TableCell[][] {
  const parts: [string, PersonOnReport | null][] = [
    ['Author', people.author],
    ['Reviewed by', people.reviewer],
    ['Authorised for issue by', people.authoriser],
  ]
  return parts.map(([part, person]) => [
    { text: runs(part), style: 'label' },
    { text: runs(person?.name ?? 'Not yet named') },
    { text: runs(person?.role ?? dash), color: INK.muted },
  ])
}

const plain = {
  hLineWidth: () => 0,
  vLineWidth: () => 0,
  paddingTop: () => 3,
  paddingBottom: () => 3,
}

function amendment(input: ReportPdfInput): Content[] {
  const replaced = input.report.replaces
  const lines: Content[] = []
  if (replaced)
    lines.push({
      text: runs(
        `This revision ${input.report.revision} replaces revision ${replaced.revision}. Reason for the amendment: ${replaced.reason}`,
      ),
      bold: true,
      margin: [0, 8, 0, 0],
    })
  if (input.report.draft)
    lines.push({
      text: runs('Draft preview: not issued. Its contents may change before the report is issued.'),
      color: INK.draft,
      bold: true,
      margin: [0, 8, 0, 0],
    })
  return lines
}

/** The laboratory, what the report is, for whom, about what, when, and who answers for it. */
export function titlePage(input: ReportPdfInput): Content[] {
  return [
    { text: runs(input.laboratory.name), fontSize: 18, bold: true, color: INK.accent },
    ...input.laboratory.addressLines.map((line): Content => ({ text: runs(line), style: 'label' })),
    {
      canvas: [
        {
          type: 'line',
          x1: 0,
          y1: 8,
          x2: CONTENT_WIDTH,
          y2: 8,
          lineWidth: 1,
          lineColor: INK.accent,
        },
      ],
    },
    { text: runs('Test report'), style: 'label', margin: [0, 48, 0, 4] },
    { text: runs(input.case.title), fontSize: 22, bold: true, lineHeight: 1.15 },
    {
      text: runs(reportLabel(input.report)),
      fontSize: 13,
      bold: true,
      color: INK.accent,
      margin: [0, 10, 0, 0],
    },
    ...amendment(input),
    {
      table: { widths: [150, '*'], body: fieldRows(input) },
      layout: plain,
      margin: [0, 36, 0, 0],
    },
    { text: runs('Responsibility for this report'), style: 'h3', margin: [0, 28, 0, 4] },
    {
      table: { widths: [150, '*', '*'], body: peopleRows(input.people) },
      layout: plain,
      pageBreak: 'after',
    },
  ]
}
